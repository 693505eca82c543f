// A device id as users and API clients send it: engine.md section 4 lists the
// ids in lower case; a pasted id with spaces around it or in capitals is the
// same device (common practice for identifiers typed by hand, no source), and
// the plan names the id in its own spelling.
import { describe, expect, it } from "vitest";
import { findDevice } from "@/lib/engine/devices";
import { planTarget } from "@/lib/engine";

describe("device id input", () => {
  it.each([" atmega328p", "atmega328p ", "\tATmega328P\n"])("%j is the ATmega328P", (id) => {
    expect(findDevice(id)?.id).toBe("atmega328p");
    const plan = planTarget({ device: id, clockHz: 16e6, periodS: 1e-3, highS: 0.25e-3 });
    expect(plan.device).toBe("atmega328p");
  });

  it("an id with a space inside is no device", () => {
    expect(findDevice("atmega 328p")).toBeUndefined();
  });
});
