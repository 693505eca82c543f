// The bad-input corpus: values a careless client, a broken form or a hostile
// one sends. Raw tokens are spliced into the JSON text, because NaN and
// Infinity cannot be written by JSON.stringify (1e999 parses to Infinity).

export const BAD_VALUES: unknown[] = [
  null,
  true,
  [],
  {},
  [1, 2],
  { nested: { deeper: [1] } },
  "",
  "   ",
  "abc",
  "NaN",
  "Infinity",
  "-Infinity",
  "1e309",
  "-1",
  "0",
  -1,
  0,
  -1e308,
  1e308,
  5e-324,
  2 ** 53 + 2,
  1.5,
  "12 furlongs",
  "4k7k",
  "10 ms ms",
  "1..2",
  "0x10",
  "\uff11\uff10",
  "10m\u0000",
  "../../../etc/passwd",
  "<script>alert(1)</script>",
  "*/ int x; /*",
  "'; drop table users; --",
  "x".repeat(70_000),
];

export const RAW_TOKENS = ["NaN", "Infinity", "-Infinity", "1e999", "-1e999", "undefined"];

export const MALFORMED_BODIES: { what: string; body: string; type?: string }[] = [
  { what: "empty", body: "" },
  { what: "truncated", body: '{"a": 1' },
  { what: "trailing comma", body: '{"a": 1,}' },
  { what: "single quotes", body: "{'a': 1}" },
  { what: "bare word", body: "hello" },
  { what: "null", body: "null" },
  { what: "array", body: "[]" },
  { what: "number", body: "42" },
  { what: "string", body: '"x"' },
  { what: "deep nesting", body: "[".repeat(5000) + "]".repeat(5000) },
  { what: "NUL bytes", body: '{"a":"\u0000"}\u0000\u0000' },
  { what: "form encoded", body: "a=1&b=2", type: "application/x-www-form-urlencoded" },
  { what: "oversize (2 MiB)", body: JSON.stringify({ note: "x".repeat(2 * 1024 * 1024) }) },
  { what: "prototype keys", body: '{"__proto__": {"admin": true}, "constructor": {"prototype": {"x": 1}}}' },
];

export const BAD_IDS = ["0", "-1", "abc", "1e3", "1.5", "99999999999", "2147483648", "1%3Bdrop", "%00"];

export const BAD_QUERY_VALUES = [
  "",
  "NaN",
  "Infinity",
  "-1",
  "1e999",
  "abc",
  "0x1f",
  "<script>",
  "%00",
  "9".repeat(400),
];

/** Every leaf path of a JSON value: ["stage","periodS"], ["targets",0,"clockHz"], ... */
export function leafPaths(value: unknown, prefix: (string | number)[] = []): (string | number)[][] {
  if (Array.isArray(value)) return value.flatMap((v, i) => leafPaths(v, [...prefix, i]));
  if (value && typeof value === "object") {
    return Object.entries(value).flatMap(([k, v]) => leafPaths(v, [...prefix, k]));
  }
  return [prefix];
}

/** A deep copy with the leaf at `path` replaced. */
export function withLeaf(value: unknown, path: (string | number)[], leaf: unknown): unknown {
  if (path.length === 0) return leaf;
  const copy = (Array.isArray(value) ? [...value] : { ...(value as object) }) as Record<
    string | number,
    unknown
  >;
  copy[path[0]] = withLeaf(copy[path[0]], path.slice(1), leaf);
  return copy;
}

const MARK = "__raw_token_here__";
/** JSON text with the leaf at `path` replaced by a raw token (NaN, 1e999, ...). */
export function withRawLeaf(value: unknown, path: (string | number)[], token: string): string {
  return JSON.stringify(withLeaf(value, path, MARK)).replace(JSON.stringify(MARK), token);
}
