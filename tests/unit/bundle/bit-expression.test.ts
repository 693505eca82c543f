// The C expression the AVR views write for a set of named register bits
// (bits() in lib/bundle/device-view.ts): one "(1 << NAME)" per bit joined by
// "|", and "0" for no bits, because the right side of "REG = ...;" must be an
// expression (ISO C11 6.5.16, assignment-expression): an empty string would
// leave "TCCR0A = ;", which no compiler takes. The bit names are avr-libc's
// (<avr/io.h>); ATmega328P DS40002061 Timer/Counter1: WGM13:12 in TCCR1B.
import { describe, expect, it } from "vitest";
import { bits } from "@/lib/bundle/device-view";

describe("bits(): register bits as a C expression", () => {
  it("no bits is the constant 0", () => {
    expect(bits([])).toBe("0");
  });

  it("one bit is a shift, several are joined by |", () => {
    expect(bits(["CS10"])).toBe("(1 << CS10)");
    expect(bits(["WGM13", "WGM12"])).toBe("(1 << WGM13) | (1 << WGM12)");
  });
});
