// Triggered and zero-cross firmware exists for all six devices (engine.md
// section 6); a device without it would have such a plan refused by the
// bundle, naming the device, and never shipped as a free-running image.
import { describe, expect, it } from "vitest";
import { buildBundleSources } from "@/lib/bundle";
import { listDevices } from "@/lib/engine";
import { TRIGGER_VIEWS } from "@/lib/bundle/build";
import { buildRefusal, TRIGGER_DEVICES } from "@/lib/bundle/buildable";

const stage = { kind: "timer555-monostable", r: 10e3, c: 1e-6 } as const;

describe("bundle and triggered plans", () => {
  it("every device the engine lists has triggered firmware, so none is refused", () => {
    expect([...TRIGGER_DEVICES].sort()).toEqual(
      listDevices()
        .map((d) => d.id)
        .sort(),
    );
    for (const d of listDevices()) expect(buildRefusal({ device: d.id, start: "zero-cross" })).toBeNull();
  });

  it("a device without triggered firmware would be refused by name, on the start field", () => {
    const r = buildRefusal({ device: "no-such-part", start: "trigger" });
    expect(r?.field).toBe("start");
    expect(r?.message).toMatch(/no firmware for triggered starts on no-such-part yet/);
    expect(buildRefusal({ device: "no-such-part", start: "free" })).toBeNull();
  });

  it.each([
    ["atmega328p", 8e6, /ISR\(INT0_vect, ISR_NAKED\)/],
    ["attiny85", 8e6, /ISR\(INT0_vect, ISR_NAKED\)/],
    ["rp2040", 48e6, /void trig_edge_isr\(void\)/],
    ["stm32g031", 16e6, /void trig_edge_isr\(void\)/],
    ["pic12f1840", 4e6, /void __interrupt\(\) trigger_isr\(void\)/],
    ["msp430g2553", 1e6, /trig_edge_isr:/],
  ] as const)("builds a zero-cross %s target with its trigger firmware", (device, clockHz, handler) => {
    const files = buildBundleSources({
      retrofit: { name: "Refusal check" },
      revision: 1,
      stage,
      targets: [{ device, clockHz, periodS: 0.01, highS: 1e-4, start: "zero-cross", delayS: 0.005 }],
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
