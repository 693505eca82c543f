// Triggered and zero-cross firmware exists for the AVRs, the RP2040 and the
// STM32G031 so far (engine.md section 6): on any other device such a plan must be refused by the bundle,
// naming the target and the device, and never shipped as a free-running image.
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleTargetRequest } from "@/lib/bundle";
import { isEngineError } from "@/lib/engine";
import { TRIGGER_VIEWS } from "@/lib/bundle/build";
import { TRIGGER_DEVICES } from "@/lib/bundle/buildable";

const stage = { kind: "timer555-monostable", r: 10e3, c: 1e-6 } as const;

function refusal(target: BundleTargetRequest & Record<string, unknown>) {
  try {
    buildBundleSources({ retrofit: { name: "Refusal check" }, revision: 1, stage, targets: [target] });
  } catch (e) {
    return e;
  }
  throw new Error("accepted, expected a refusal");
}

describe("bundle and triggered plans", () => {
  it.each(["trigger", "zero-cross"] as const)(
    "refuses a %s plan on the PIC12F1840 before writing any file, naming the target",
    (start) => {
      const e = refusal({
        device: "pic12f1840",
        clockHz: 4e6,
        periodS: 0.01,
        highS: 1e-4,
        start,
        delayS: 0.005,
      });
      expect(isEngineError(e)).toBe(true);
      expect((e as { field?: string }).field).toBe("targets.0");
      expect((e as Error).message).toMatch(/no firmware for triggered starts on PIC12F1840 yet/);
    },
  );

  it.each([
    ["atmega328p", 8e6, /ISR\(INT0_vect, ISR_NAKED\)/],
    ["attiny85", 8e6, /ISR\(INT0_vect, ISR_NAKED\)/],
    ["rp2040", 48e6, /void trig_edge_isr\(void\)/],
    ["stm32g031", 16e6, /void trig_edge_isr\(void\)/],
  ] as const)("builds a zero-cross %s target with its trigger firmware", (device, clockHz, handler) => {
    const files = buildBundleSources({
      retrofit: { name: "Refusal check" },
      revision: 1,
      stage,
      targets: [{ device, clockHz, periodS: 0.01, highS: 1e-4, start: "zero-cross", delayS: 0.005 } as never],
    });
    const main = files.find((f) => f.path === `${device}/src/main.c`);
    expect(String(main?.content)).toMatch(handler);
  });

  it("still builds the same target free-running", () => {
    const files = buildBundleSources({
      retrofit: { name: "Refusal check" },
      revision: 1,
      stage,
      targets: [{ device: "atmega328p", clockHz: 16e6, periodS: 0.01, highS: 1e-4 }],
    });
    expect(files.some((f) => f.path === "atmega328p/src/main.c")).toBe(true);
  });
});

// The trigger device set is written twice on purpose: buildable.ts (no
// template imports, read by the browser's live plans) and build.ts's views.
// Both must name the same devices, or live plans and generation disagree.
describe("trigger device lists", () => {
  it("TRIGGER_DEVICES (live plans) names exactly the devices TRIGGER_VIEWS (generation) renders", () => {
    expect([...TRIGGER_DEVICES].sort()).toEqual(Object.keys(TRIGGER_VIEWS).sort());
  });
});
