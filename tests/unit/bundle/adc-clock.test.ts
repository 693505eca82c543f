import { describe, expect, it } from "vitest";
import { adcClock } from "@/lib/bundle/adc-clock";

describe("ADC clock dividers stay inside each document's range", () => {
  it("AVR: ATmega328P 16 MHz /128 = 125 kHz, ATtiny85 1 MHz /8 = 125 kHz (both datasheets' ADC prescaling, 50..200 kHz)", () => {
    expect(adcClock("atmega328p", 16e6)).toMatchObject({ divider: 128, bits: 7, adcClockHz: 125e3 });
    expect(adcClock("attiny85", 1e6)).toMatchObject({ divider: 8, bits: 3, adcClockHz: 125e3 });
    expect(() => adcClock("atmega328p", 32768)).toThrow(/clockHz/);
  });
  it("PIC12F1840: 32 MHz -> Fosc/32 (ADCS 010), TAD 1.0 us; 4 MHz -> Fosc/4 (100), TAD 1.0 us (TAD table, DS41419D Table 16-1)", () => {
    expect(adcClock("pic12f1840", 32e6)).toMatchObject({ divider: 32, bits: 0b010 });
    expect(adcClock("pic12f1840", 4e6)).toMatchObject({ divider: 4, bits: 0b100 });
    // 31.25 kHz: even Fosc/2 gives TAD 64 us, beyond the table's 6 us
    expect(() => adcClock("pic12f1840", 31.25e3)).toThrow(/clockHz/);
  });
  it("MSP430G2553: 16 MHz SMCLK /3 = 5.33 MHz, 1 MHz /1 (ADC10CLK up to 6.3 MHz, from memory)", () => {
    expect(adcClock("msp430g2553", 16e6)).toMatchObject({ divider: 3, bits: 2 });
    expect(adcClock("msp430g2553", 1e6)).toMatchObject({ divider: 1, bits: 0 });
  });
  it("STM32G031: 64 MHz PCLK /2 = 32 MHz (CKMODE 01, fADC up to 35 MHz, from memory)", () => {
    expect(adcClock("stm32g031", 64e6)).toMatchObject({ divider: 2, bits: 0b01, adcClockHz: 32e6 });
  });
  it("names the register field it sets as each document names it", () => {
    // ATmega328P / ATtiny25/45/85 datasheets, ADCSRA ADPS2:0; PIC12F1840 DS40001441 ADCON1 ADCS<2:0>;
    // SLAU144 ADC10CTL1 ADC10DIVx; RM0444 ADC_CFGR2 CKMODE; RP2040 datasheet 2.15 Clocks, CLK_ADC_CTRL AUXSRC
    expect(adcClock("atmega328p", 16e6).field).toBe("ADCSRA.ADPS");
    expect(adcClock("attiny85", 1e6).field).toBe("ADCSRA.ADPS");
    expect(adcClock("pic12f1840", 32e6).field).toBe("ADCON1.ADCS");
    expect(adcClock("msp430g2553", 16e6).field).toBe("ADC10CTL1.ADC10DIVx");
    expect(adcClock("stm32g031", 64e6).field).toBe("ADC_CFGR2.CKMODE");
    expect(adcClock("rp2040", 125e6).field).toBe("CLK_ADC_CTRL.AUXSRC");
  });
  it("RP2040: clk_adc is 48 MHz whatever clk_sys runs at (RP2040 datasheet 4.9 ADC, from PLL_USB)", () => {
    expect(adcClock("rp2040", 125e6)).toMatchObject({ divider: 1, adcClockHz: 48e6 });
    expect(adcClock("rp2040", 12e6)).toMatchObject({ divider: 1, adcClockHz: 48e6 });
  });
  it("every result lies inside its stated range", () => {
    for (const [d, f] of [
      ["atmega328p", 8e6],
      ["pic12f1840", 16e6],
      ["msp430g2553", 8e6],
      ["stm32g031", 16e6],
      ["rp2040", 125e6],
    ] as const) {
      const c = adcClock(d, f);
      expect(c.adcClockHz).toBeGreaterThanOrEqual(c.rangeHz.min);
      expect(c.adcClockHz).toBeLessThanOrEqual(c.rangeHz.max);
    }
  });
});
