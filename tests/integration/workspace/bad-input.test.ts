// Bad input at every workspace endpoint: a field-level message, the right
// status, and nothing stored (row counts before and after).
import { beforeAll, describe, expect, it } from "vitest";
import { makeToken, makeUser } from "../../helpers/users";
import { newRetrofitBody, rowCounts, TWO_TARGETS, UJT_STAGE, jsonClient, type JsonClient } from "./fixtures";

let api: JsonClient;
let retrofitId: number;
let userId: number;
beforeAll(async () => {
  const eng = await makeUser("engineer");
  userId = eng.id;
  api = jsonClient(await makeToken(eng.id));
  const res = await api("/api/v1/retrofits", { method: "POST", body: newRetrofitBody() });
  retrofitId = ((await res.json()) as { retrofit: { id: number } }).retrofit.id;
});

type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };

async function refused(
  path: string,
  init: { method: string; body?: unknown },
  status: number,
  fields: string[],
) {
  const before = await rowCounts(userId);
  const res = await api(path, init);
  expect(res.status).toBe(status);
  const body = (await res.json()) as ErrorBody;
  for (const f of fields)
    expect(body.error.fields?.[f], `field ${f} in ${JSON.stringify(body)}`).toBeTruthy();
  expect(await rowCounts(userId)).toEqual(before);
  return body;
}

describe("bad input stores nothing", () => {
  it("create: missing facts", async () => {
    await refused("/api/v1/retrofits", { method: "POST", body: { name: "", site: "" } }, 400, [
      "name",
      "site",
      "assetTag",
    ]);
  });

  it("create: unreadable and out-of-range stage values, bad tolerance", async () => {
    const body = {
      ...newRetrofitBody(),
      stage: { ...UJT_STAGE, timingR: "4x7", eta: "1.2", tolerances: { timingC: "ten" } },
    };
    const r = await refused("/api/v1/retrofits", { method: "POST", body }, 400, [
      "stage.timingR",
      "stage.eta",
      "stage.tolerances.timingC",
    ]);
    expect(r.error.fields!["stage.timingR"]).toMatch(/4x7/);
  });

  it("create: unknown stage kind", async () => {
    await refused(
      "/api/v1/retrofits",
      { method: "POST", body: { ...newRetrofitBody(), stage: { kind: "tube" } } },
      400,
      ["stage.kind"],
    );
  });

  it("create: target with a clock option the device lacks and a clock out of range", async () => {
    const targets = [
      { ...TWO_TARGETS[0], clockSource: "internal" },
      { ...TWO_TARGETS[1], clockHz: "100M" },
    ];
    await refused("/api/v1/retrofits", { method: "POST", body: { ...newRetrofitBody(), targets } }, 400, [
      "targets.0.clockSource",
      "targets.1.clockHz",
    ]);
  });

  it("update: bad stage and bad timer leave the stored retrofit as it was", async () => {
    const before = await (await api(`/api/v1/retrofits/${retrofitId}`)).json();
    await refused(
      `/api/v1/retrofits/${retrofitId}`,
      {
        method: "PATCH",
        body: {
          name: "",
          stage: { ...UJT_STAGE, timingC: "-1n" },
          targets: [{ ...TWO_TARGETS[0], timer: "TIMER9" }],
        },
      },
      400,
      ["name", "stage.timingC", "targets.0.timer"],
    );
    const after = await (await api(`/api/v1/retrofits/${retrofitId}`)).json();
    expect(after).toEqual(before);
  });

  it("plan: bad stage and no targets", async () => {
    await refused("/api/v1/plan", { method: "POST", body: { stage: { kind: "ujt" }, targets: [] } }, 400, [
      "stage.supplyV",
      "targets",
    ]);
  });

  it("generate: a target that cannot make the period is refused with 422 naming it", async () => {
    // A 10 µs period is 1.25 cycles of HSI16 / 128 = 125 kHz (RM0444 HSIDIV): below the timer's 2 counts.
    const body = {
      ...newRetrofitBody(),
      stage: { kind: "measured", periodS: "10u", highS: "5u" },
      targets: [{ device: "stm32g031", clockSource: "hsi16", clockHz: "125k", mode: "pwm" }],
    };
    const created = await api("/api/v1/retrofits", { method: "POST", body });
    const id = ((await created.json()) as { retrofit: { id: number } }).retrofit.id;
    const r = await refused(`/api/v1/retrofits/${id}/revisions`, { method: "POST" }, 422, ["targets.0"]);
    expect(r.error.message).toMatch(/target 1 \(stm32g031/);
  });

  it("token: empty name", async () => {
    await refused("/api/v1/tokens", { method: "POST", body: { name: " " } }, 400, ["name"]);
  });

  it("list: unknown sort column", async () => {
    const res = await api("/api/v1/retrofits?sort=password&page=0");
    expect(res.status).toBe(400);
    const body = (await res.json()) as ErrorBody;
    expect(body.error.fields?.sort).toBeTruthy();
    expect(body.error.fields?.page).toBeTruthy();
  });

  it("not JSON", async () => {
    const before = await rowCounts(userId);
    const res = await api("/api/v1/retrofits", { method: "POST", body: "{name:" });
    expect(res.status).toBe(400);
    expect(await rowCounts(userId)).toEqual(before);
  });
});
