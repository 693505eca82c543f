// Shared by the fuzz tests: where a result carries NaN.
/** Paths of every NaN number inside a value. */
export function nanPaths(value: unknown, path = "$", out: string[] = []): string[] {
  if (typeof value === "number") {
    if (Number.isNaN(value)) out.push(path);
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => nanPaths(v, `${path}[${i}]`, out));
  } else if (value && typeof value === "object") {
    for (const [k, v] of Object.entries(value)) nanPaths(v, `${path}.${k}`, out);
  }
  return out;
}
