// ADC clock set-up per device: the divider the generated code writes and the
// ADC clock it gives, always inside the range the device's document asks for.
// Each rule names its source; a clock no divider can bring into range is
// refused with a message naming clockHz.

export interface AdcClock {
  device: string;
  /** register and field written, as the document names them */
  field: string;
  /** divider from the CPU (or bus) clock */
  divider: number;
  /** value written into the field */
  bits: number;
  adcClockHz: number;
  /** the document's range for the ADC clock */
  rangeHz: { min: number; max: number };
  source: string;
}

function refuse(device: string, clockHz: number, range: { min: number; max: number }): never {
  throw new Error(
    `clockHz: no ADC divider of the ${device} puts ${clockHz} Hz inside ${range.min}..${range.max} Hz; choose another clock.`,
  );
}

function pick(
  device: string,
  clockHz: number,
  options: readonly { div: number; bits: number }[],
  range: { min: number; max: number },
  field: string,
  source: string,
): AdcClock {
  const d = options.find((o) => clockHz / o.div <= range.max);
  if (!d || clockHz / d.div < range.min) refuse(device, clockHz, range);
  return { device, field, divider: d.div, bits: d.bits, adcClockHz: clockHz / d.div, rangeHz: range, source };
}

// ADPS2:0 (000 also divides by 2; 001 is used).
const AVR_ADPS = [2, 4, 8, 16, 32, 64, 128].map((div, i) => ({ div, bits: i + 1 }));
// ADCS<2:0>: Fosc/2 000, /4 100, /8 001, /16 101, /32 010, /64 110 (FRC x11 not used: it is not clock-locked).
const PIC_ADCS = [
  { div: 2, bits: 0b000 },
  { div: 4, bits: 0b100 },
  { div: 8, bits: 0b001 },
  { div: 16, bits: 0b101 },
  { div: 32, bits: 0b010 },
  { div: 64, bits: 0b110 },
];
// ADC10DIVx: /1../8 (bits = divider - 1), clock ADC10SSELx = SMCLK.
const MSP_DIV = Array.from({ length: 8 }, (_, i) => ({ div: i + 1, bits: i }));
// ADC_CFGR2 CKMODE: 01 = PCLK/2, 10 = PCLK/4 (00 = asynchronous clock, 11 = PCLK/1 only with a 50 % duty PCLK: not used).
const STM_CKMODE = [
  { div: 2, bits: 0b01 },
  { div: 4, bits: 0b10 },
];

export function adcClock(device: string, clockHz: number): AdcClock {
  switch (device) {
    case "atmega328p":
    case "attiny85":
      // ATmega328P DS40002061 / ATtiny25/45/85 datasheet, ADC "Prescaling and Conversion Timing":
      // 50..200 kHz for full 10-bit resolution.
      return pick(
        device,
        clockHz,
        AVR_ADPS,
        { min: 50e3, max: 200e3 },
        "ADCSRA.ADPS",
        "ADC chapter, prescaling",
      );
    case "pic12f1840":
      // TAD 1.0..6.0 us: ADC clock period table of the enhanced mid-range parts
      // (PIC16(L)F1824/1828 DS41419D Table 16-1; the PIC12F1840 DS40001441 table is the same, from memory).
      return pick(
        device,
        clockHz,
        PIC_ADCS,
        { min: 1 / 6e-6, max: 1 / 1e-6 },
        "ADCON1.ADCS",
        "ADC clock period (TAD) table",
      );
    case "msp430g2553":
      // ADC10CLK up to 6.3 MHz (MSP430G2x53 datasheet, 10-bit ADC timing parameters, from memory); 0.45 MHz lower bound from memory.
      return pick(
        device,
        clockHz,
        MSP_DIV,
        { min: 0.45e6, max: 6.3e6 },
        "ADC10CTL1.ADC10DIVx",
        "10-bit ADC timing parameters",
      );
    case "stm32g031":
      // fADC up to 35 MHz (STM32G031x4/x6/x8 datasheet, ADC characteristics, from memory); RM0444 ADC_CFGR2 CKMODE.
      return pick(
        device,
        clockHz,
        STM_CKMODE,
        { min: 0.14e6, max: 35e6 },
        "ADC_CFGR2.CKMODE",
        "ADC characteristics",
      );
    case "rp2040":
      // RP2040 datasheet 4.9: clk_adc 48 MHz (from PLL_USB, adc-control.h), independent of clk_sys.
      return {
        device,
        field: "CLK_ADC_CTRL.AUXSRC",
        divider: 1,
        bits: 0,
        adcClockHz: 48e6,
        rangeHz: { min: 48e6, max: 48e6 },
        source: "ADC section 4.9",
      };
    default:
      throw new Error(`device: no ADC clock rule for ${device}.`);
  }
}
