// The field a kept selector's refusal names (lib/bundle/adc-control.ts): a
// part states a plain limit as "control: ..." or "targets: ..."; the bundle
// turns it into an engine error (our 4xx shape) whose field is control.values
// for the former and the target itself for the latter, never a server error.
// The rule is ours (common practice, no source). The ATtiny85 part is
// replaced here by one that states the limit the test names, so each branch
// is reached on purpose; the real parts' limits are checked in
// kept-control.test.ts and kept-part-limits.test.ts.
import { describe, expect, it, vi } from "vitest";
import { buildBundleSources } from "@/lib/bundle";
import type { EngineError } from "@/lib/engine";
import { GOLDEN_CASES } from "../../golden/cases";
import { expectEngineError } from "../engine/expect-engine-error";

const said = vi.hoisted(() => ({ message: "" }));
vi.mock("@/lib/bundle/selector-avr", async (original) => ({
  ...(await original<typeof import("@/lib/bundle/selector-avr")>()),
  renderAttiny85Selector: () => {
    throw new Error(said.message);
  },
}));

const kept = GOLDEN_CASES.find((c) => c.name === "kept-pot-555")!.spec;
const tiny = kept.targets.find((t) => t.device === "attiny85")!;
function refusal(message: string): EngineError {
  said.message = message;
  return expectEngineError(
    () =>
      buildBundleSources({
        ...kept,
        control: { kind: "selector", field: "c", values: [100e-9, 150e-9] },
        targets: [kept.targets[0], tiny],
      }),
    "invalid-request",
  );
}

describe("kept selector refusals name their field", () => {
  it("a 'control:' limit names control.values", () => {
    const err = refusal("control: position 2 needs more than 256 counts.");
    expect(err.field).toBe("control.values");
    expect(err.message).toBe(
      "target 2 (attiny85) cannot keep the selector: position 2 needs more than 256 counts.",
    );
  });

  it("a 'targets:' limit names the target", () => {
    const err = refusal("targets: PB2 is a selector input.");
    expect(err.field).toBe("targets.1");
    expect(err.message).toBe("target 2 (attiny85) cannot keep the selector: PB2 is a selector input.");
  });

  it("a 'control.<field>:' limit keeps that field", () => {
    expect(refusal("control.values: at most 3 positions.").field).toBe("control.values");
    const err = refusal("control.field: the part varies c only.");
    expect(err.field).toBe("control.field");
    expect(err.message).toBe("target 2 (attiny85) cannot keep the selector: the part varies c only.");
  });
});
