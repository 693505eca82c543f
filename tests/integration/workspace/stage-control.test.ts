// The stage's adjustable value is stored with the stage: it survives a save and
// reload, a bad control is refused with a message naming its field and stores
// nothing, and null clears it.
import { beforeAll, describe, expect, it } from "vitest";
import { makeToken, makeUser } from "../../helpers/users";
import { jsonClient, newRetrofitBody, UJT_STAGE, type JsonClient } from "./fixtures";

let eng: JsonClient;
let id: number;

// UJT relaxation stage: the rate pot sits in place of timingR (a resistance field).
const POT = { kind: "pot", field: "timingR", seriesR: "4k7", trackR: "47k", taper: "linear" };

beforeAll(async () => {
  eng = jsonClient(await makeToken((await makeUser("engineer")).id));
  const res = await eng("/api/v1/retrofits", {
    method: "POST",
    body: { ...newRetrofitBody(), control: POT },
  });
  expect(res.status).toBe(201);
  id = ((await res.json()) as { retrofit: { id: number } }).retrofit.id;
});

async function detail() {
  const res = await eng(`/api/v1/retrofits/${id}`);
  return (await res.json()) as { control: unknown; stage: { timingR: number } };
}

describe("stage control storage", () => {
  it("a created control reads back in SI units", async () => {
    expect((await detail()).control).toEqual({
      kind: "pot",
      field: "timingR",
      seriesR: 4700,
      trackR: 47000,
      taper: "linear",
    });
  });

  it("a bad control names its field and changes nothing", async () => {
    const before = await detail();
    const res = await eng(`/api/v1/retrofits/${id}`, {
      method: "PATCH",
      body: { stage: { ...UJT_STAGE, timingR: "10k" }, control: { ...POT, trackR: "4x7" } },
    });
    expect(res.status).toBe(400);
    const body = JSON.stringify(await res.json());
    expect(body).toContain("control.trackR");
    expect(await detail()).toEqual(before);
  });

  it("a stage saved without a control keeps it; null clears it", async () => {
    const keep = await eng(`/api/v1/retrofits/${id}`, { method: "PATCH", body: { stage: UJT_STAGE } });
    expect(keep.status).toBe(200);
    expect((await detail()).control).toMatchObject({ kind: "pot", trackR: 47000 });
    const sel = await eng(`/api/v1/retrofits/${id}`, {
      method: "PATCH",
      body: { stage: UJT_STAGE, control: { kind: "selector", field: "timingC", values: "100n, 220n, 470n" } },
    });
    expect(sel.status).toBe(200);
    expect((await detail()).control).toEqual({
      kind: "selector",
      field: "timingC",
      values: [1e-7, 2.2e-7, 4.7e-7],
    });
    await eng(`/api/v1/retrofits/${id}`, { method: "PATCH", body: { stage: UJT_STAGE, control: null } });
    expect((await detail()).control).toBeNull();
  });

  it("generation carries a stored pot into plan.json and the checklist", async () => {
    // NE555 astable (TI SLFS022): T = ln2 (Ra + 2 Rb) C; Rb is the rate pot.
    const res = await eng("/api/v1/retrofits", {
      method: "POST",
      body: {
        ...newRetrofitBody(),
        stage: { kind: "timer555-astable", supplyV: "5", ra: "1k", rb: "10k", c: "100n" },
        control: { kind: "pot", field: "rb", seriesR: "2k2", trackR: "47k", taper: "linear" },
        targets: [
          { device: "atmega328p", clockSource: "crystal", clockHz: "16M", mode: "pwm", timer: "TIMER1" },
        ],
      },
    });
    expect(res.status).toBe(201);
    const rid = ((await res.json()) as { retrofit: { id: number } }).retrofit.id;
    const gen = await eng(`/api/v1/retrofits/${rid}/revisions?wait=1`, { method: "POST" });
    expect(gen.status).toBe(201);
    const rev = ((await gen.json()) as { revision: { id: number } }).revision.id;
    const plan = (await (await eng(`/api/v1/revisions/${rev}/files/plan.json`)).json()) as {
      control: { field: string };
      targets: { control: { steps: number; worstStepPpm: number } }[];
    };
    expect(plan.control.field).toBe("rb");
    expect(plan.targets[0].control.steps).toBe(64);
    expect(plan.targets[0].control.worstStepPpm).toBeGreaterThan(0);
    const checklist = await (await eng(`/api/v1/revisions/${rev}/files/atmega328p/CHECKLIST.md`)).text();
    expect(checklist).toMatch(/\| P3 \| Turn the control fully clockwise/);
  });
});
