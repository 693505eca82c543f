// The bad-input corpus against every route in routes.ts that takes input:
// each leaf of a valid body replaced by each bad value, raw NaN/Infinity
// tokens, malformed and oversize bodies, bad ids in URLs, bad query values and
// broken CSV uploads. Never a 500; every refusal is { error: { code, message } }
// and stores nothing; NaN and Infinity in a number field are always refused.
import { beforeAll, describe, expect, it } from "vitest";
import { isErrorShape, send, type Answer } from "./client";
import {
  BAD_IDS,
  BAD_QUERY_VALUES,
  BAD_VALUES,
  leafPaths,
  MALFORMED_BODIES,
  RAW_TOKENS,
  withLeaf,
  withRawLeaf,
} from "./corpus";
import { ROUTES, type RouteEntry } from "./routes";
import { fingerprint, makeWorld, squareCsv, type World } from "./world";

let w: World;
beforeAll(async () => {
  w = await makeWorld();
});

/** Checks one answer; `state` carries the last fingerprint across requests. */
async function judge(res: Answer, what: string, state: { fp: string }, mustRefuse = false) {
  const line = `${what} -> ${res.status} ${res.text.slice(0, 200)}`;
  expect(res.status, line).toBeLessThan(500);
  const now = await fingerprint(w);
  if (res.status >= 400) {
    expect(isErrorShape(res.body), line).toBe(true);
    expect(now, `${line}: rows changed by a refused request`).toBe(state.fp);
  } else {
    expect(mustRefuse, `${line}: accepted`).toBe(false);
  }
  state.fp = now;
}

/** A server may answer 413 and close before reading an oversize body; the
 *  client then sees a reset. That is a refusal too (rows are still checked). */
async function sendOrReset(go: () => Promise<Answer>): Promise<Answer> {
  try {
    return await go();
  } catch (e) {
    const code = (e as { cause?: { code?: string } }).cause?.code;
    if (code !== "ECONNRESET" && code !== "EPIPE") throw e;
    const body = { error: { code: "payload_too_large", message: "connection closed by the server" } };
    return { status: 413, text: JSON.stringify(body), headers: new Headers(), body };
  }
}

const NON_FINITE = new Set(["NaN", "Infinity", "-Infinity", "1e309"]);
const isNumericLeaf = (v: unknown) =>
  typeof v === "number" || (typeof v === "string" && /^[0-9.]+ ?[a-zA-Zµ]*$/.test(v));

const jsonRoutes = ROUTES.filter((r) => r.input === "json");
const queryRoutes = ROUTES.filter((r) => r.input === "query");
const idRoutes = ROUTES.filter((r) => r.pattern.includes("[id]"));

describe.each(jsonRoutes)("JSON body of $method $pattern", (r: RouteEntry) => {
  it(
    "every leaf x every bad value, raw non-finite tokens, malformed bodies",
    { timeout: 600_000 },
    async () => {
      const req = await r.build(w, "admin");
      const base = req.json;
      const state = { fp: await fingerprint(w) };
      for (const path of leafPaths(base)) {
        const original = path.reduce<unknown>((o, k) => (o as Record<string | number, unknown>)[k], base);
        for (const bad of BAD_VALUES) {
          const res = await send(w, "admin", r.method, { ...req, json: withLeaf(base, path, bad) });
          const mustRefuse = isNumericLeaf(original) && typeof bad === "string" && NON_FINITE.has(bad);
          await judge(
            res,
            `${r.method} ${req.path} ${path.join(".")}=${JSON.stringify(bad).slice(0, 40)}`,
            state,
            mustRefuse,
          );
        }
        for (const token of RAW_TOKENS) {
          const res = await send(w, "admin", r.method, req, {
            body: withRawLeaf(base, path, token),
            type: "application/json",
          });
          await judge(
            res,
            `${r.method} ${req.path} ${path.join(".")}=${token} (raw)`,
            state,
            isNumericLeaf(original),
          );
        }
      }
      for (const m of MALFORMED_BODIES) {
        // A route with a larger body limit gets an oversize body past its own limit.
        const body =
          m.what.startsWith("oversize") && r.maxBodyBytes
            ? JSON.stringify({ note: "x".repeat(r.maxBodyBytes + 1024 * 1024) })
            : m.body;
        const res = await sendOrReset(() =>
          send(w, "admin", r.method, req, { body, type: m.type ?? "application/json" }),
        );
        // An empty body is a valid "no options" request where the body is optional.
        await judge(res, `${r.method} ${req.path} body ${m.what}`, state, m.what.startsWith("oversize"));
        if (m.what.startsWith("oversize")) expect(res.status).toBe(413);
      }
    },
  );
});

// Numbers are read strictly (issue 15 point 8): a list, a boolean or hex text in
// a number field used to be coerced by Number() ([16] -> 16, true -> 1,
// "0x10" -> 16). Now each is a 400 that names the field and stores nothing.
const COERCIBLE: unknown[] = [true, [2], "0x10"];
describe.each(jsonRoutes)("numbers in $method $pattern are not coerced", (r: RouteEntry) => {
  it(
    "every number leaf x a list, a boolean, hex text: 400 naming the leaf",
    { timeout: 300_000 },
    async () => {
      const req = await r.build(w, "admin");
      const base = req.json;
      const state = { fp: await fingerprint(w) };
      const numeric = leafPaths(base).filter((path) =>
        isNumericLeaf(path.reduce<unknown>((o, k) => (o as Record<string | number, unknown>)[k], base)),
      );
      for (const path of numeric) {
        for (const bad of COERCIBLE) {
          const res = await send(w, "admin", r.method, { ...req, json: withLeaf(base, path, bad) });
          const what = `${r.method} ${req.path} ${path.join(".")}=${JSON.stringify(bad)}`;
          await judge(res, what, state, true);
          expect(res.status, `${what} -> ${res.text.slice(0, 200)}`).toBe(400);
          const fields = (res.body as { error: { fields?: Record<string, string> } }).error.fields ?? {};
          expect(Object.keys(fields), `${what} -> ${res.text.slice(0, 200)}`).toContain(path.join("."));
        }
      }
    },
  );
});

it("the strict-number corpus reaches number leaves (plan body: tolerance, clock, stage times)", async () => {
  const plan = ROUTES.find((r) => r.method === "POST" && r.pattern === "/api/v1/plan")!;
  const body = (await plan.build(w, "admin")).json;
  const numeric = leafPaths(body).filter((p) =>
    isNumericLeaf(p.reduce<unknown>((o, k) => (o as Record<string | number, unknown>)[k], body)),
  );
  expect(numeric.map((p) => p.join("."))).toEqual(
    expect.arrayContaining([
      "stage.periodS",
      "stage.highS",
      "targets.0.clockHz",
      "targets.0.requiredTolerancePct",
    ]),
  );
});

describe.each(queryRoutes)("query of $method $pattern", (r: RouteEntry) => {
  it("every parameter x every bad value", { timeout: 300_000 }, async () => {
    const req = await r.build(w, "admin");
    const url = new URL(req.path, "http://x");
    const state = { fp: await fingerprint(w) };
    for (const key of [...url.searchParams.keys()]) {
      for (const bad of BAD_QUERY_VALUES) {
        const u = new URL(url);
        u.searchParams.set(key, bad);
        const res = await send(w, "admin", r.method, { path: u.pathname + u.search });
        await judge(res, `${r.method} ${u.pathname}?${key}=${bad.slice(0, 30)}`, state);
      }
    }
  });
});

describe("ids in URLs", () => {
  it.each(idRoutes.map((r) => [`${r.method} ${r.pattern}`, r] as const))(
    "%s",
    { timeout: 300_000 },
    async (_, r) => {
      for (const id of BAD_IDS) {
        const path = r.pattern.replace("[id]", id).replace("[...path]", "README.md");
        const req = await r.build(w, "admin");
        const state = { fp: await fingerprint(w) };
        const res = await send(w, "admin", r.method, {
          ...req,
          path: path + (req.path.match(/\?.*$/)?.[0] ?? ""),
        });
        await judge(res, `${r.method} ${path}`, state, true);
        expect([400, 404], `${path}: ${res.status}`).toContain(res.status);
      }
    },
  );

  it("file paths that climb out of the revision are not found", async () => {
    const state = { fp: await fingerprint(w) };
    for (const p of ["..%2F..%2Fetc%2Fpasswd", "%00", "src/..%2F..%2FREADME.md", "a%5Cb"]) {
      const res = await send(w, "admin", "GET", {
        path: `/api/v1/revisions/${w.revision.released}/files/${p}`,
      });
      await judge(res, `files/${p}`, state, true);
      expect(res.text).not.toMatch(/root:x:0:0/);
    }
  });
});

describe("capture upload: CSV edge cases", () => {
  const good = squareCsv();
  const CASES: { what: string; body: string | Uint8Array<ArrayBuffer>; type?: string; mayStore?: boolean }[] =
    [
      { what: "empty", body: "" },
      { what: "header only", body: "Time (s),CH1 (V)\n" },
      { what: "one row", body: "Time (s),CH1 (V)\n0,1\n" },
      { what: "text in numbers", body: "t,v\n0,a\n1,b\n2,c\n" },
      { what: "NaN values", body: "t,v\n" + Array.from({ length: 200 }, (_, i) => `${i},NaN`).join("\n") },
      {
        what: "Infinity values",
        body: "t,v\n" + Array.from({ length: 200 }, (_, i) => `${i},Infinity`).join("\n"),
      },
      {
        what: "1e999 values",
        body: "t,v\n" + Array.from({ length: 200 }, (_, i) => `${i},1e999`).join("\n"),
      },
      {
        what: "time going backwards",
        body: "t,v\n" + Array.from({ length: 200 }, (_, i) => `${200 - i},${i % 2}`).join("\n"),
      },
      {
        what: "constant level",
        body: "t,v\n" + Array.from({ length: 500 }, (_, i) => `${i * 1e-3},1`).join("\n"),
      },
      { what: "ragged columns", body: "t,v\n0,1,2,3\n1\n2,0\n,,\n" },
      { what: "binary", body: new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0, 0, 0, 0, 0xff, 0xfe, 0, 1, 2]) },
      { what: "only separators", body: ",,,,\n;;;;\n\t\t\t\n" },
      { what: "huge single line", body: "1,".repeat(200_000) },
      { what: "CRLF and BOM", body: "\ufeff" + good.replace(/\n/g, "\r\n"), mayStore: true },
      { what: "semicolon separated", body: good.replace(/,/g, ";"), mayStore: true },
      {
        what: "multipart without a file part",
        body: '--b\r\nContent-Disposition: form-data; name="x"\r\n\r\n1\r\n--b--\r\n',
        type: "multipart/form-data; boundary=b",
      },
      { what: "multipart without a boundary", body: good, type: "multipart/form-data" },
      {
        what: "multipart never closed",
        body:
          '--b\r\nContent-Disposition: form-data; name="file"; filename="a.csv"\r\n\r\n' + good.slice(0, 500),
        type: "multipart/form-data; boundary=b",
      },
    ];

  it.each(CASES.map((c) => [c.what, c] as const))("%s", async (_, c) => {
    const state = { fp: await fingerprint(w) };
    const res = await send(
      w,
      "technician",
      "POST",
      { path: `/api/v1/captures?retrofitId=${w.retrofitId}` },
      {
        body: c.body,
        type: c.type ?? "text/csv",
      },
    );
    await judge(res, `capture ${c.what}`, state, !c.mayStore);
  });
});

describe("paths that match no handler", () => {
  // "/api/v1/revisions/%2e%2e/files" is normalised by the router before any
  // handler runs: a redirect or the framework's 404, never a 500.
  it.each(["/api/v1/revisions/%2e%2e/files", "/api/v1/nothing-here", "/api/v1/retrofits/1/nothing"])(
    "%s",
    async (path) => {
      const res = await send(w, "admin", "GET", { path });
      expect([308, 404], `${path}: ${res.status}`).toContain(res.status);
    },
  );
});

describe("ids past the integer column and impossible audit dates", () => {
  // Row ids are PostgreSQL `integer` (at most 2^31 - 1, PostgreSQL documentation,
  // "Numeric Types", table 8.2); year 0000 does not exist in its timestamps
  // ("Date/Time Types"). Each of these used to reach the database and answer 500.
  const big = 2 ** 31;
  const cases: { what: string; method: "GET" | "POST"; path: (w: World) => string; json?: unknown }[] = [
    {
      what: "field check revisionId",
      method: "POST",
      path: () => "/api/v1/field-checks",
      json: { revisionId: big, measuredPeriodS: 0.01, signedOffBy: "A. Tester" },
    },
    {
      what: "field check captureId",
      method: "POST",
      path: () => "/api/v1/field-checks",
      json: { revisionId: 1, captureId: big, measuredPeriodS: 0.01, signedOffBy: "A. Tester" },
    },
    {
      what: "use-as-stage retrofitId",
      method: "POST",
      path: (w) => `/api/v1/captures/${w.captureId}/use-as-stage`,
      json: { retrofitId: big },
    },
    { what: "audit actor", method: "GET", path: () => `/api/v1/audit?actor=${big}` },
    { what: "audit from year 0000", method: "GET", path: () => "/api/v1/audit?from=0000-01-01" },
    { what: "audit to year 0000", method: "GET", path: () => "/api/v1/audit?to=0000-12-31" },
  ];
  it.each(cases)("$what", async (c) => {
    const state = { fp: await fingerprint(w) };
    const res = await send(w, "admin", c.method, { path: c.path(w), json: c.json });
    await judge(res, c.what, state, true);
    expect(res.status, `${c.what}: ${res.text.slice(0, 200)}`).toBe(400);
  });
});

describe("measurements no device can make", () => {
  // Bounds from the devices (lib/validation/measurement.ts, checked against the
  // planner in tests/unit/validation/measurement-bounds.test.ts): a period from
  // two cycles of the fastest clock to the longest count at the slowest clock.
  // 5e-324 s (the smallest double) and 1e12 s used to be stored.
  const cases: { what: string; path: (w: World) => string; json: (w: World) => unknown; field: string }[] = [
    {
      what: "plan: measured stage of 5e-324 s",
      path: () => "/api/v1/plan",
      json: () => ({
        stage: { kind: "measured", periodS: 5e-324, highS: 5e-324 },
        targets: [{ device: "atmega328p", clockSource: "crystal", clockHz: "16M", mode: "pwm" }],
      }),
      field: "stage.periodS",
    },
    {
      what: "new retrofit: measured stage of 1e12 s",
      path: () => "/api/v1/retrofits",
      json: (w) => ({
        name: `Absurd ${w.tag}`,
        site: w.site,
        assetTag: `ABS-${w.tag}`,
        stage: { kind: "measured", periodS: 1e12, highS: 1 },
      }),
      field: "stage.periodS",
    },
    {
      what: "field check: period of 5e-324 s",
      path: () => "/api/v1/field-checks",
      json: (w) => ({
        revisionId: w.revision.released,
        measuredPeriodS: 5e-324,
        measuredHighS: 2e-3,
        signedOffBy: "A. Tester",
      }),
      field: "measuredPeriodS",
    },
    {
      what: "field check: high time of 1e12 s",
      path: () => "/api/v1/field-checks",
      json: (w) => ({
        revisionId: w.revision.released,
        measuredPeriodS: 10e-3,
        measuredHighS: 1e12,
        signedOffBy: "A. Tester",
      }),
      field: "measuredHighS",
    },
  ];
  it.each(cases)("$what", async (c) => {
    const state = { fp: await fingerprint(w) };
    const res = await send(w, "admin", "POST", { path: c.path(w), json: c.json(w) });
    await judge(res, c.what, state, true);
    expect(res.status, res.text.slice(0, 300)).toBe(400);
    const fields = (res.body as { error: { fields?: Record<string, string> } }).error.fields ?? {};
    expect(fields[c.field], res.text.slice(0, 300)).toMatch(/outside what any target device can make: from/);
  });
});

describe("plain text: bidi controls anywhere, line breaks in one-line fields", () => {
  // Unicode Standard Annex #9 explicit directional controls (U+202A..U+202E,
  // U+2066..U+2069) display text in another order than it is stored; a line
  // break in a name forges a second line in mail, checklists and the audit log.
  // Leaves that are not stored text: the one-time token (looked up, 404 when
  // unknown) and the password (any character is allowed in a secret).
  const NOT_TEXT = new Set(["token", "password"]);
  const isTextLeaf = (v: unknown) => typeof v === "string" && !isNumericLeaf(v);
  it.each(jsonRoutes.map((r) => [`${r.method} ${r.pattern}`, r] as const))(
    "%s: U+202E in every text leaf is a 400 naming the leaf",
    { timeout: 300_000 },
    async (_, r) => {
      const req = await r.build(w, "admin");
      const base = req.json;
      const state = { fp: await fingerprint(w) };
      for (const path of leafPaths(base)) {
        const value = path.reduce<unknown>((o, k) => (o as Record<string | number, unknown>)[k], base);
        if (!isTextLeaf(value) || NOT_TEXT.has(String(path[path.length - 1]))) continue;
        const res = await send(w, "admin", r.method, {
          ...req,
          json: withLeaf(base, path, `${String(value)}\u202Egnp.exe`),
        });
        const what = `${r.method} ${req.path} ${path.join(".")}+U+202E`;
        await judge(res, what, state, true);
        expect(res.status, `${what} -> ${res.text.slice(0, 200)}`).toBe(400);
        const fields = (res.body as { error: { fields?: Record<string, string> } }).error.fields ?? {};
        expect(Object.keys(fields), `${what} -> ${res.text.slice(0, 200)}`).toContain(path.join("."));
      }
    },
  );

  const ONE_LINE: {
    what: string;
    path: (w: World) => string;
    method: "POST" | "PATCH";
    json: (w: World) => unknown;
    field: string;
  }[] = [
    {
      what: "retrofit name",
      method: "POST",
      path: () => "/api/v1/retrofits",
      json: (w) => ({ name: "Kiln\r\nSite: forged", site: w.site, assetTag: `NL-${w.tag}` }),
      field: "name",
    },
    {
      what: "retrofit site",
      method: "PATCH",
      path: (w) => `/api/v1/retrofits/${w.retrofitId}`,
      json: () => ({ site: "North\nSouth" }),
      field: "site",
    },
    {
      what: "token name",
      method: "POST",
      path: () => "/api/v1/tokens",
      json: () => ({ name: "a\u2028b" }),
      field: "name",
    },
    {
      what: "invitation name",
      method: "POST",
      path: () => "/api/v1/invitations",
      json: (w) => ({ email: `nl-${w.tag}@test.invalid`, name: "New\nAdmin: yes", role: "technician" }),
      field: "name",
    },
    {
      what: "field check signature",
      method: "POST",
      path: () => "/api/v1/field-checks",
      json: (w) => ({
        revisionId: w.revision.released,
        measuredPeriodS: 10e-3,
        measuredHighS: 2e-3,
        signedOffBy: "A. Tester\nReleased by: chief",
      }),
      field: "signedOffBy",
    },
  ];
  it.each(ONE_LINE)("a line break in the $what is a 400 naming it", async (c) => {
    const state = { fp: await fingerprint(w) };
    const res = await send(w, "admin", c.method, { path: c.path(w), json: c.json(w) });
    await judge(res, c.what, state, true);
    expect(res.status, res.text.slice(0, 300)).toBe(400);
    const fields = (res.body as { error: { fields?: Record<string, string> } }).error.fields ?? {};
    expect(fields[c.field], res.text.slice(0, 300)).toMatch(/one line/);
  });
});
