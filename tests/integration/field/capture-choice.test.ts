// Channel and probe attenuation chosen at upload (?channel=&probe=) and on the
// capture page (POST /api/v1/captures/:id/measurement): the measurement is
// made again from the stored file, a choice the file cannot have is refused
// with the field named and nothing changes. Levels are the histogram modes
// of IEEE Std 181-2011 (5.2.1.3); the two-channel file below is our own.
import { count, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { captures } from "@/db/schema";
import { Session, signedIn } from "../../helpers/server";
import { makeUser, TEST_PASSWORD } from "../../helpers/users";

type View = {
  capture: {
    id: number;
    measurement: {
      highLevelV: number;
      periodS: { mean: number };
      scaling: { voltageColumn: number; probe: number };
    };
  };
};
type Err = { error: { code: string; message: string; fields?: Record<string, string> } };

/** CH1: 0/3300 mV, 1 ms period; CH2: 0/500 mV, 2 ms period; 10 us samples. */
function twoChannelCsv(): string {
  const rows = ["Vertical Units,mV", "Time (s),CH1,CH2"];
  for (let i = 0; i < 1000; i++) {
    rows.push(`${i * 1e-5},${(i + 95) % 100 < 30 ? 3300 : 0},${(i + 195) % 200 < 50 ? 500 : 0}`);
  }
  return rows.join("\n") + "\n";
}

let eng: Session;
let engineerId: number;

async function stored(): Promise<number> {
  const [row] = await db.select({ n: count() }).from(captures).where(eq(captures.uploadedBy, engineerId));
  return row.n;
}

async function upload(query: string) {
  const res = await eng.fetch(`/api/v1/captures${query}`, {
    method: "POST",
    body: twoChannelCsv(),
    headers: { "content-type": "text/csv" },
  });
  return { status: res.status, body: (await res.json()) as View & Err };
}

beforeAll(async () => {
  const engineer = await makeUser("engineer");
  engineerId = engineer.id;
  eng = await signedIn(engineer.email, TEST_PASSWORD);
});

describe("capture channel and probe choice", () => {
  it("upload measures the chosen channel through the chosen probe; bad choices store nothing", async () => {
    const up = await upload("?channel=2&probe=10");
    expect(up.status).toBe(201);
    // 500 mV at the scope input x 10 = 5 V at the probe tip; CH2's period 2 ms.
    expect(up.body.capture.measurement.highLevelV).toBeCloseTo(5, 9);
    expect(up.body.capture.measurement.periodS.mean).toBeCloseTo(2e-3, 12);
    expect(up.body.capture.measurement.scaling).toMatchObject({ voltageColumn: 1, probe: 10 });

    const before = await stored();
    const badProbe = await upload("?probe=3");
    expect(badProbe.status).toBe(400);
    expect(badProbe.body.error.fields?.probe).toMatch(/1x, 10x, 100x/);
    const noChannel = await upload("?channel=3");
    expect(noChannel.status).toBe(422);
    expect(noChannel.body.error.fields?.channel).toMatch(/no channel 3.*2 voltage column/);
    expect(await stored()).toBe(before);
  });

  it("re-measures a stored capture with another channel and probe; a refused choice changes nothing", async () => {
    const up = await upload("");
    const id = up.body.capture.id;
    expect(up.body.capture.measurement.highLevelV).toBeCloseTo(3.3, 9);

    const again = await eng.json<View>(`/api/v1/captures/${id}/measurement`, {
      method: "POST",
      body: JSON.stringify({ channel: 2, probe: 100 }),
    });
    expect(again.status).toBe(200);
    // 500 mV x 100 = 50 V.
    expect(again.body.capture.measurement.highLevelV).toBeCloseTo(50, 9);
    const [row] = await db.select({ m: captures.measurement }).from(captures).where(eq(captures.id, id));
    expect((row.m as View["capture"]["measurement"]).scaling).toMatchObject({ voltageColumn: 1, probe: 100 });

    for (const bad of [{ channel: 5, probe: 1 }, { channel: 1, probe: 2 }, { channel: 0 }]) {
      const res = await eng.json<Err>(`/api/v1/captures/${id}/measurement`, {
        method: "POST",
        body: JSON.stringify(bad),
      });
      expect(res.status).toBe(422);
      expect(Object.keys(res.body.error.fields ?? {}).length).toBeGreaterThan(0);
    }
    const [after] = await db.select({ m: captures.measurement }).from(captures).where(eq(captures.id, id));
    expect(after.m).toEqual(row.m);
  });
});
