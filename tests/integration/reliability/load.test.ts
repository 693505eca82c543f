// Short load check on loopback: the plan API and a bundle download at 50
// concurrent connections, bounded in count and time, with zero errors. No
// timing assertions here: figures belong in the benchmark (scripts/bench).
import { describe, expect, it } from "vitest";
import { load } from "@/scripts/bench/load";
import { BASE_URL } from "../../helpers/server";
import { makeWorld } from "./world";

const PLAN = JSON.stringify({
  stage: { kind: "measured", periodS: "10m", highS: "2m" },
  targets: [{ device: "atmega328p", clockSource: "crystal", clockHz: "16M", mode: "pwm" }],
});

/** autocannon's `amount` (stop after n requests) is missing from its type declarations. */
const bounded = (amount: number) => ({ amount }) as object;

describe("50 concurrent connections", () => {
  it("plan API and bundle download answer every request with 2xx", { timeout: 180_000 }, async () => {
    const w = await makeWorld();
    const auth = { authorization: `Bearer ${w.actors.technician.token}` };
    const plan = await load({
      url: `${BASE_URL}/api/v1/plan`,
      method: "POST",
      headers: { ...auth, "content-type": "application/json" },
      body: PLAN,
      connections: 50,
      ...bounded(500),
      duration: 20,
    });
    expect(plan.statuses, JSON.stringify(plan.statuses)).toEqual({ 200: plan.requests });
    expect(plan.errors).toBe(0);
    expect(plan.requests).toBe(500);

    const bundle = await load({
      url: `${BASE_URL}/api/v1/revisions/${w.revision.released}/bundle`,
      headers: auth,
      connections: 50,
      ...bounded(300),
      duration: 20,
    });
    expect(bundle.statuses, JSON.stringify(bundle.statuses)).toEqual({ 200: bundle.requests });
    expect(bundle.errors).toBe(0);
    expect(bundle.requests).toBe(300);
  });
});
