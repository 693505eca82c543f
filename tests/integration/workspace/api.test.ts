// The versioned API driven by a personal token, as a team's own script would:
// plan, create a retrofit, generate a revision, download the bundle twice.
import { createHash } from "node:crypto";
import JSZip from "jszip";
import { beforeAll, describe, expect, it } from "vitest";
import { makeToken, makeUser } from "../../helpers/users";
import { newRetrofitBody, jsonClient, type JsonClient } from "./fixtures";

let api: JsonClient;
beforeAll(async () => {
  const eng = await makeUser("engineer");
  api = jsonClient(await makeToken(eng.id));
});

type Plan = {
  ok: true;
  plan: {
    periodS: number;
    periodCounts: number;
    divider: number;
    registers: Record<string, number>;
    periodErrorPpm: number;
    targetPeriodS: number;
  };
};

describe("API with a personal token", () => {
  it("plans a 555 astable: analysis by the datasheet formula, timer by the fast PWM formula", async () => {
    const res = await api("/api/v1/plan", {
      method: "POST",
      body: {
        stage: { kind: "timer555-astable", supplyV: 12, ra: "10k", rb: "68k", c: "10u" },
        targets: [
          { device: "atmega328p", clockSource: "crystal", clockHz: "16M", mode: "pwm", timer: "TIMER1" },
        ],
      },
    });
    expect(res.status).toBe(200);
    const body = (await res.json()) as { analysis: { periodS: number; highS: number }; plans: Plan[] };
    // TI NE555 data sheet, astable operation: tH = ln2 (RA + RB) C, tL = ln2 RB C.
    const tH = Math.LN2 * (10e3 + 68e3) * 10e-6;
    const tL = Math.LN2 * 68e3 * 10e-6;
    expect(body.analysis.highS).toBeCloseTo(tH, 9);
    expect(body.analysis.periodS).toBeCloseTo(tH + tL, 9);
    const { plan } = body.plans[0];
    // ATmega328P data sheet, 16-bit Timer/Counter1 fast PWM: f = f_clk / (N (1 + TOP)), TOP = ICR1.
    expect(plan.periodS).toBeCloseTo((plan.divider * (1 + plan.registers.ICR1)) / 16e6, 12);
    expect(plan.periodErrorPpm).toBeCloseTo(
      ((plan.periodS - plan.targetPeriodS) / plan.targetPeriodS) * 1e6,
      6,
    );
  });

  it("creates a retrofit, generates r1 and downloads the same bundle bytes twice, 304 on If-None-Match", async () => {
    const created = await api("/api/v1/retrofits", { method: "POST", body: newRetrofitBody() });
    expect(created.status).toBe(201);
    const { retrofit } = (await created.json()) as { retrofit: { id: number } };

    const read = await api(`/api/v1/retrofits/${retrofit.id}`);
    const detail = (await read.json()) as { stage: { timingR: number; timingC: number }; targets: unknown[] };
    expect(detail.stage.timingR).toBe(33000); // "33k", IEC 60062 letter code
    expect(detail.stage.timingC).toBe(220e-9);
    expect(detail.targets).toHaveLength(2);

    const gen = await api(`/api/v1/retrofits/${retrofit.id}/revisions?wait=1`, { method: "POST" });
    expect(gen.status).toBe(201);
    const { revision } = (await gen.json()) as {
      revision: { id: number; number: number; bundleSha256: string };
    };
    expect(revision.number).toBe(1);

    const first = await api(`/api/v1/revisions/${revision.id}/bundle`);
    expect(first.status).toBe(200);
    expect(first.headers.get("content-type")).toBe("application/zip");
    expect(first.headers.get("content-disposition")).toMatch(
      /^attachment; filename="clockgraft-T-[a-z0-9]+-r1\.zip"$/,
    );
    const bytes1 = Buffer.from(await first.arrayBuffer());
    const sha = createHash("sha256").update(bytes1).digest("hex");
    expect(sha).toBe(revision.bundleSha256);
    expect(first.headers.get("etag")).toBe(`"${sha}"`);

    const second = await api(`/api/v1/revisions/${revision.id}/bundle`);
    const bytes2 = Buffer.from(await second.arrayBuffer());
    expect(bytes2.equals(bytes1)).toBe(true);
    expect(second.headers.get("etag")).toBe(first.headers.get("etag"));

    const cached = await api(`/api/v1/revisions/${revision.id}/bundle`, {
      headers: { "if-none-match": first.headers.get("etag")! },
    });
    expect(cached.status).toBe(304);
    expect((await cached.arrayBuffer()).byteLength).toBe(0);

    const zip = await JSZip.loadAsync(bytes1);
    const names = Object.keys(zip.files);
    for (const f of [
      "README.md",
      "plan.json",
      "atmega328p/src/main.c",
      "atmega328p/PINMAP.md",
      "atmega328p/CHECKLIST.md",
      "stm32g031/src/main.c",
      "stm32g031/PINMAP.md",
      "stm32g031/CHECKLIST.md",
    ]) {
      expect(names).toContain(f);
    }
    const planJson = JSON.parse(await zip.file("plan.json")!.async("string")) as {
      revision: number;
      targets: unknown[];
    };
    expect(planJson.revision).toBe(1);
    expect(planJson.targets).toHaveLength(2);

    const files = await api(`/api/v1/revisions/${revision.id}/files`);
    const list = (await files.json()) as { files: { path: string; content: string; sha256: string }[] };
    const main = list.files.find((f) => f.path === "atmega328p/src/main.c")!;
    expect(main.content).toBe(await zip.file("atmega328p/src/main.c")!.async("string"));
    expect(main.sha256).toBe(createHash("sha256").update(main.content).digest("hex"));

    const one = await api(`/api/v1/revisions/${revision.id}/files/atmega328p/src/main.c`);
    expect(one.status).toBe(200);
    expect(await one.text()).toBe(main.content);
  });

  it("lists retrofits with server-side search, filter, sort and pages", async () => {
    const tag = `Q${Math.random().toString(36).slice(2, 7)}`;
    for (const n of ["b", "a", "c"]) {
      const body = { ...newRetrofitBody(`${tag} ${n}`), site: `Site ${tag}` };
      expect((await api("/api/v1/retrofits", { method: "POST", body })).status).toBe(201);
    }
    const res = await api(
      `/api/v1/retrofits?q=${tag}&site=Site%20${tag}&kind=ujt&state=none&sort=name&dir=asc&pageSize=2&page=1`,
    );
    const page1 = (await res.json()) as { items: { name: string; latest: unknown }[]; total: number };
    expect(page1.total).toBe(3);
    expect(page1.items.map((i) => i.name)).toEqual([`${tag} a`, `${tag} b`]);
    expect(page1.items[0].latest).toBeNull();
    const res2 = await api(`/api/v1/retrofits?q=${tag}&sort=name&dir=desc&pageSize=2&page=2`);
    expect(((await res2.json()) as { items: { name: string }[] }).items.map((i) => i.name)).toEqual([
      `${tag} a`,
    ]);
    const none = await api(`/api/v1/retrofits?q=${tag}&kind=timer555-astable`);
    expect(((await none.json()) as { total: number }).total).toBe(0);
  });

  it("makes, uses and revokes a token; a revoked token gets 401", async () => {
    const made = await api("/api/v1/tokens", { method: "POST", body: { name: "script" } });
    expect(made.status).toBe(201);
    const { token } = (await made.json()) as { token: { id: number; secret: string } };
    const second = jsonClient(token.secret);
    expect((await second("/api/v1/tokens")).status).toBe(200);
    const listed = (await (await second("/api/v1/tokens")).json()) as { tokens: Record<string, unknown>[] };
    expect(JSON.stringify(listed)).not.toContain(token.secret);
    expect((await api(`/api/v1/tokens/${token.id}`, { method: "DELETE" })).status).toBe(200);
    expect((await second("/api/v1/tokens")).status).toBe(401);
  });
});
