// Input-to-timer latency counts of the triggered plans (lib/engine/solver/trigger-inputs.ts),
// worked out here from the datasheets' interrupt response rules.
import { describe, expect, it } from "vitest";
import { TRIGGER_INPUTS } from "@/lib/engine/solver/trigger-inputs";

describe("triggered plans: interrupt response of the input", () => {
  it("AVR response = 4 cycles to the vector + the vector's jump + 2 to finish the busy loop's rjmp", () => {
    // ATmega328P datasheet 7.7.1 / ATtiny85 datasheet 4.7.1 "Interrupt Response Time": four
    // clock cycles minimum before the vector runs. The vector itself: ATmega328P has 2-word
    // vectors holding a JMP (3 cycles), ATtiny85 1-word vectors holding an RJMP (2 cycles)
    // (AVR Instruction Set Manual cycle counts); the busy loop's RJMP takes 2 cycles.
    const RJMP = 2;
    const JMP = 3;
    expect(TRIGGER_INPUTS.atmega328p.responseCycles).toBe(4 + JMP + RJMP);
    expect(TRIGGER_INPUTS.attiny85.responseCycles).toBe(4 + RJMP + RJMP);
  });

  it("pins not checked against a datasheet say so", () => {
    // The STM32G031 TSSOP-20 PA1 pin number and the RP2040 QFN-56 GPIO15 pin number are
    // recalled, not checked (the source comments say "from memory"): the pin map must mark them.
    expect(TRIGGER_INPUTS.stm32g031.input.fromMemory).toBe(true);
    expect(TRIGGER_INPUTS.rp2040.input.fromMemory).toBe(true);
  });
});
