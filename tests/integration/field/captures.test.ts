// Capture upload through the API: streamed measurement, the size limit, bad
// files refused with the line named and nothing stored, and "use as stage".
import { and, count, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { auditEvents, captures, stages } from "@/db/schema";
import { Session, signedIn } from "../../helpers/server";
import { makeUser, TEST_PASSWORD } from "../../helpers/users";
import { makeRetrofit, squareCsv } from "./fixtures";

type ErrorBody = { error: { code: string; message: string } };
type CaptureBody = {
  capture: {
    id: number;
    sha256: string;
    byteSize: number;
    measurement: {
      samples: number;
      periodS: { mean: number; count: number };
      highS: { mean: number };
      duty: number;
    };
  };
};

let engineer: Awaited<ReturnType<typeof makeUser>>;
let eng: Session;

async function storedBy(userId: number): Promise<number> {
  const [row] = await db.select({ n: count() }).from(captures).where(eq(captures.uploadedBy, userId));
  return row.n;
}

async function upload(
  s: Session,
  body: BodyInit,
  query = "",
  headers: Record<string, string> = { "content-type": "text/csv" },
) {
  const res = await s.fetch(`/api/v1/captures${query}`, { method: "POST", body, headers });
  return { status: res.status, body: (await res.json()) as unknown };
}

beforeAll(async () => {
  engineer = await makeUser("engineer");
  eng = await signedIn(engineer.email, TEST_PASSWORD);
});

describe("capture upload", () => {
  it("measures and stores a good capture (multipart), with its sha256", async () => {
    // 1 kHz, 25 % duty square wave sampled every 1 us; IEEE Std 181-2011
    // 5.3.3 period (rise to next rise 50 % crossing) and pulse duration.
    const csv = squareCsv({ periodS: 1e-3, highS: 0.25e-3, dtS: 1e-6, periods: 8 });
    const form = new FormData();
    form.append("file", new Blob([csv], { type: "text/csv" }), "bench-1khz.csv");
    const before = await storedBy(engineer.id);
    const res = await eng.fetch("/api/v1/captures", { method: "POST", body: form });
    const body = (await res.json()) as CaptureBody & { capture: { fileName: string } };
    expect(res.status).toBe(201);
    expect(body.capture.fileName).toBe("bench-1khz.csv");
    expect(body.capture.byteSize).toBe(Buffer.byteLength(csv));
    const m = body.capture.measurement;
    expect(m.periodS.count).toBe(8); // 9 rising edges: the record ends just after one
    // Edges fall on whole samples: within one sample interval (1 us) of the truth.
    expect(Math.abs(m.periodS.mean - 1e-3)).toBeLessThan(1e-6);
    expect(Math.abs(m.highS.mean - 0.25e-3)).toBeLessThan(1e-6);
    expect(m.duty).toBeCloseTo(0.25, 3);
    expect(await storedBy(engineer.id)).toBe(before + 1);

    const [row] = await db.select().from(captures).where(eq(captures.id, body.capture.id));
    expect(row.content.toString("utf8")).toBe(csv);
    // sha256 of the exact bytes (FIPS 180-4), computed independently here.
    const { createHash } = await import("node:crypto");
    expect(row.sha256).toBe(createHash("sha256").update(csv).digest("hex"));
    expect((row.measurement as { plot: unknown[] }).plot.length).toBeGreaterThan(100);

    const read = await eng.json<CaptureBody>(`/api/v1/captures/${body.capture.id}`);
    expect(read.status).toBe(200);
    expect(read.body.capture.sha256).toBe(row.sha256);
    expect(JSON.stringify(read.body)).not.toMatch(/"plot"/);

    const plot = await eng.json<{ points: { tS: number }[]; edges: { kind: string }[] }>(
      `/api/v1/captures/${body.capture.id}/plot`,
    );
    expect(plot.status).toBe(200);
    expect(plot.body.edges.filter((e) => e.kind === "rise")).toHaveLength(9);
    const zoom = await eng.json<{ points: { tS: number }[]; edges: unknown[] }>(
      `/api/v1/captures/${body.capture.id}/plot?fromS=0.0002&toS=0.0014`,
    );
    expect(zoom.status).toBe(200);
    // A 1.2 ms window at 1 us is ~1200 samples: below the 2000-point budget, so every sample is a point.
    expect(zoom.body.points.length).toBeGreaterThan(1190);
    expect(zoom.body.points.length).toBeLessThan(1210);
    // Edges at 0.35 ms (fall), 1.1 ms (rise), 1.35 ms (fall) lie in the window.
    expect(zoom.body.edges.length).toBe(3);
  });

  it("keeps an upload's file name whole: quotes, non-ASCII; bidi controls dropped", async () => {
    // undici's FormData writes the name as the HTML standard's form encoding
    // does ('"' as %22); curl escapes with a backslash. The old reader cut
    // both at the first quote ("say ").
    const csv = squareCsv({ periodS: 1e-3, highS: 0.25e-3, dtS: 10e-6, periods: 4 });
    const form = new FormData();
    form.append("file", new Blob([csv], { type: "text/csv" }), 'say "hi" Ω\u202E.csv');
    const viaForm = await eng.fetch("/api/v1/captures", { method: "POST", body: form });
    expect(viaForm.status).toBe(201);
    expect(((await viaForm.json()) as { capture: { fileName: string } }).capture.fileName).toBe(
      'say "hi" Ω.csv',
    );
    const raw =
      '--b\r\nContent-Disposition: form-data; name="file"; filename="bench \\"A\\".csv"\r\n' +
      `Content-Type: text/csv\r\n\r\n${csv}\r\n--b--\r\n`;
    const viaCurl = await eng.fetch("/api/v1/captures", {
      method: "POST",
      body: raw,
      headers: { "content-type": "multipart/form-data; boundary=b" },
    });
    expect(viaCurl.status).toBe(201);
    expect(((await viaCurl.json()) as { capture: { fileName: string } }).capture.fileName).toBe(
      'bench "A".csv',
    );
  });

  it("accepts a raw text/csv body and names the file from the header", async () => {
    const csv = squareCsv({ periodS: 2e-3, highS: 1e-3, dtS: 10e-6, periods: 4 });
    const res = await upload(eng, csv, "", { "content-type": "text/csv", "x-file-name": "scope/raw.csv" });
    expect(res.status).toBe(201);
    const body = res.body as CaptureBody & { capture: { fileName: string } };
    expect(body.capture.fileName).toBe("raw.csv");
    expect(Math.abs(body.capture.measurement.periodS.mean - 2e-3)).toBeLessThan(10e-6);
  });

  // Each bad file: a 4xx whose message names the line, and no row stored.
  const binary = Buffer.concat([
    Buffer.from("Time (s),CH1 (V)\n0,0\n"),
    Buffer.from([0x89, 0x00, 0x01, 0x02, 0x0a, 0x41]),
  ]);
  const square = squareCsv({ periodS: 1e-3, highS: 0.5e-3, dtS: 10e-6, periods: 3 }).trimEnd().split("\n");
  const backwards = [...square];
  backwards[30] = `${(25e-6).toPrecision(12)},5`; // line 31 earlier than line 30
  const nan = [...square];
  nan[40] = `${(39e-5).toPrecision(12)},NaN`;
  const BAD: { name: string; body: BodyInit; status: number; line: RegExp }[] = [
    { name: "empty", body: "", status: 422, line: /line 1\b/ },
    { name: "one column", body: "Reading (V)\n0.1\n0.2\n0.3\n", status: 422, line: /line 2\b/ },
    {
      name: "text",
      body: "Bench notes\nthe probe was loose\nno trace saved\n",
      status: 422,
      line: /line 3\b/,
    },
    { name: "binary", body: new Uint8Array(binary), status: 422, line: /line 3\b.*binary/ },
    { name: "non-monotonic time", body: backwards.join("\n"), status: 422, line: /line 31\b/ },
    { name: "NaN", body: nan.join("\n"), status: 422, line: /line 41\b.*NaN/ },
  ];
  for (const bad of BAD) {
    it(`refuses ${bad.name} with ${bad.status}, naming the line, and stores nothing`, async () => {
      const before = await storedBy(engineer.id);
      const res = await upload(eng, bad.body);
      expect(res.status).toBe(bad.status);
      const e = (res.body as ErrorBody).error;
      expect(e.code).toBe("unprocessable");
      expect(e.message).toMatch(bad.line);
      expect(await storedBy(engineer.id)).toBe(before);
    });
  }

  it("refuses a capture over the limit while streaming (no Content-Length) with 413 naming the limit", async () => {
    const limit = Number(process.env.CAPTURE_MAX_BYTES ?? 64 * 1024 * 1024);
    const row = Buffer.from("0.000001000,1.0000\n"); // 19 bytes a line
    const block = Buffer.alloc(row.length * 50_000);
    for (let i = 0; i < 50_000; i++) row.copy(block, i * row.length);
    let sent = 0;
    const stream = new ReadableStream<Uint8Array>({
      start(c) {
        c.enqueue(new TextEncoder().encode("Time (s),CH1 (V)\n"));
      },
      pull(c) {
        if (sent > limit + block.length) return c.close();
        sent += block.length;
        c.enqueue(new Uint8Array(block));
      },
    });
    const before = await storedBy(engineer.id);
    const res = await eng.fetch("/api/v1/captures", {
      method: "POST",
      body: stream,
      headers: { "content-type": "text/csv" },
      duplex: "half",
    } as RequestInit);
    expect(res.status).toBe(413);
    const e = ((await res.json()) as ErrorBody).error;
    expect(e.code).toBe("payload_too_large");
    expect(e.message).toContain(`${limit / (1024 * 1024)} MiB limit`);
    expect(e.message).toMatch(/line \d+/);
    expect(await storedBy(engineer.id)).toBe(before);
  });

  it("refuses a declared Content-Length over the limit before reading", async () => {
    const limit = Number(process.env.CAPTURE_MAX_BYTES ?? 64 * 1024 * 1024);
    const res = await fetch(`${eng.base}/api/v1/captures`, {
      method: "POST",
      body: new Uint8Array(limit + 1).fill(0x30),
      headers: { "content-type": "text/csv", cookie: eng.cookieHeader(), origin: eng.base },
    }).catch((err: unknown) => err as Error);
    // The server may answer and close before the client has sent everything.
    if (res instanceof Response) {
      expect(res.status).toBe(413);
      expect(((await res.json()) as ErrorBody).error.message).toContain("MiB limit");
    } else {
      expect(res.message).toMatch(/fetch failed|socket|closed|EPIPE|reset/i);
    }
  });

  it("refuses an upload from a reviewer (403) and from nobody (401)", async () => {
    const rev = await makeUser("reviewer");
    const s = await signedIn(rev.email, TEST_PASSWORD);
    expect((await upload(s, "Time,V\n0,0\n")).status).toBe(403);
    expect((await upload(new Session(), "Time,V\n0,0\n")).status).toBe(401);
  });
});

describe("use as stage", () => {
  it("makes a measured stage linked to the capture, with an audit event", async () => {
    const retrofit = await makeRetrofit({ createdBy: engineer.id });
    const csv = squareCsv({ periodS: 4e-3, highS: 1e-3, dtS: 4e-6, periods: 6 });
    const up = await upload(eng, csv, `?retrofitId=${retrofit.id}`);
    expect(up.status).toBe(201);
    const captureId = (up.body as CaptureBody).capture.id;

    const tech = await makeUser("technician");
    const ts = await signedIn(tech.email, TEST_PASSWORD);
    const refused = await ts.json(`/api/v1/captures/${captureId}/use-as-stage`, {
      method: "POST",
      body: "{}",
    });
    expect(refused.status).toBe(403);

    const res = await eng.json<{
      stage: { kind: string; periodS: number; highS: number; captureId: number };
    }>(`/api/v1/captures/${captureId}/use-as-stage`, { method: "POST", body: "{}" });
    expect(res.status).toBe(200);
    expect(res.body.stage.kind).toBe("measured");
    const [stage] = await db.select().from(stages).where(eq(stages.retrofitId, retrofit.id));
    expect(stage.kind).toBe("measured");
    expect(stage.captureId).toBe(captureId);
    const values = stage.values as { kind: string; periodS: number; highS: number };
    expect(Math.abs(values.periodS - 4e-3)).toBeLessThan(4e-6);
    expect(Math.abs(values.highS - 1e-3)).toBeLessThan(4e-6);
    const events = await db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.action, "stage.from-capture"), eq(auditEvents.subjectId, retrofit.id)));
    expect(events).toHaveLength(1);
    expect((events[0].details as { captureId: number }).captureId).toBe(captureId);
  });

  it("asks which retrofit when the capture has none", async () => {
    const up = await upload(eng, squareCsv({ periodS: 1e-3, highS: 0.5e-3, dtS: 10e-6, periods: 3 }));
    const id = (up.body as CaptureBody).capture.id;
    const res = await eng.json<{ error: { fields: Record<string, string> } }>(
      `/api/v1/captures/${id}/use-as-stage`,
      {
        method: "POST",
        body: "{}",
      },
    );
    expect(res.status).toBe(400);
    expect(res.body.error.fields.retrofitId).toBeTruthy();
  });
});
