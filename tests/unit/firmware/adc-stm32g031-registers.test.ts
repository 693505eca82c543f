// STM32G031 kept rate pot, proven by registers: the emulator harness
// (lib/firmware/emulate/harness/stm32g031-emu.py) has no ADC model (no ready, calibration or
// conversion flags), so the generated set-up is read back from the source and
// judged against RM0444's ADC chapter: ADC_CFGR2 CKMODE written while ADEN = 0,
// regulator (ADVREGEN) on for tADCVREG_STUP (20 us, datasheet; from memory)
// before ADCAL, ADCAL before ADEN, CHSELR bit = the channel, the pin in analog
// mode, ADC clock PCLK/2 or /4 at or below 35 MHz (datasheet ADC
// characteristics; from memory), and ARR/CCR per step = the engine table
// (period = (PSC+1)(ARR+1)/f, RM0444 general-purpose timers). Old stage: 555
// astable, T = ln2*(Ra + 2*Rb)*C (TI SLFS022). Planted faults kept as negative
// cases: wrong channel, calibration after enable, CKMODE after enable.
import { describe, expect, it } from "vitest";
import { renderStm32g031Adc } from "@/lib/bundle/adc-stm32g031";
import { buildAdcTable, type Stage } from "@/lib/engine";

const stage: Stage = { kind: "timer555-astable", supplyV: 5, ra: 1e3, rb: 10e3, c: 100e-9 };
const control = { kind: "pot", field: "rb", seriesR: 2.2e3, trackR: 47e3, taper: "linear" } as const;
const CLOCK = 16e6;
const table = buildAdcTable({ stage, control, device: "stm32g031", clockHz: CLOCK, adcBits: 12, steps: 64 });
const header = renderStm32g031Adc({ table, controlText: "rate pot as Rb" });

/** Problems of a rendered set-up against the RM0444 rules above; empty when it is right. */
function problems(src: string, channel: number): string[] {
  const out: string[] = [];
  const init = src.slice(src.indexOf("static void adc_control_init"));
  const at = (re: RegExp) => {
    const m = re.exec(init);
    return m ? m.index : -1;
  };
  const cfgr2 = at(/ADC_CFGR2 = \((\d)u << 30\)/);
  const vreg = at(/ADC_CR = ADC_CR_ADVREGEN;/);
  const cal = at(/ADC_CR \|= ADC_CR_ADCAL;/);
  const en = at(/ADC_CR \|= ADC_CR_ADEN;/);
  if ([cfgr2, vreg, cal, en].some((i) => i < 0)) return ["a set-up step is missing"];
  if (!(cfgr2 < en)) out.push("CKMODE written after ADEN");
  if (!(vreg < cal && cal < en)) out.push("calibration not between regulator on and enable");
  const ck = Number(/ADC_CFGR2 = \((\d)u << 30\)/.exec(init)![1]);
  const div = ck === 1 ? 2 : ck === 2 ? 4 : NaN;
  if (!(CLOCK / div <= 35e6)) out.push(`CKMODE ${ck} gives no allowed ADC clock`);
  const loops = Number(/i < (\d+)u; i\+\+/.exec(init)?.[1]);
  if (!(loops >= 20e-6 * CLOCK)) out.push(`regulator wait ${loops} loops < 20 us`);
  const sel = /ADC_CHSELR = \(1u << (\d+)\)/.exec(init);
  if (!sel || Number(sel[1]) !== channel) out.push(`CHSELR selects ${sel?.[1]}, want ${channel}`);
  if (!init.includes(`GPIOA->MODER |= (3u << ${channel * 2})`)) out.push("pin not in analog mode");
  const arr = [...src.matchAll(/^ {2}(\d+)u,/gm)].map((m) => Number(m[1]));
  const want = [...table.steps.map((s) => s.periodCounts - 1), ...table.steps.map((s) => s.highCounts)];
  if (JSON.stringify(arr) !== JSON.stringify(want)) out.push("ARR/CCR tables differ from the engine table");
  if (!init.includes(`->PSC = ${table.plan.divider - 1}u;`)) out.push("PSC is not the table's divider - 1");
  return out;
}

describe("STM32G031 keeps the rate pot (registers, RM0444 ADC chapter)", () => {
  it("the generated set-up follows the ADC chapter", () => {
    expect(problems(header, 4)).toEqual([]);
  });
  it("each step's period is the old stage's within half a count", () => {
    const f = CLOCK / table.plan.divider;
    for (const s of table.steps) expect(Math.abs(s.periodCounts / f - s.wantS)).toBeLessThanOrEqual(0.5 / f);
    // NE555 (TI SLFS022): the maximum step is Rb = 2.2k + 47k
    expect(table.steps[63].wantS).toBeCloseTo(Math.LN2 * (1e3 + 2 * 49.2e3) * 100e-9, 9);
  });
  it("planted fault: the wrong channel is caught", () => {
    const bad = header.replace("ADC_CHSELR = (1u << 4)", "ADC_CHSELR = (1u << 5)");
    expect(bad).not.toBe(header);
    expect(problems(bad, 4)).toContain("CHSELR selects 5, want 4");
  });
  it("planted fault: calibration after enable is caught", () => {
    const lines = header.split("\n");
    const cal = lines.findIndex((l) => l.includes("ADC_CR |= ADC_CR_ADCAL;"));
    const [calLine] = lines.splice(cal, 1);
    const en = lines.findIndex((l) => l.includes("ADC_CR |= ADC_CR_ADEN;"));
    lines.splice(en + 1, 0, calLine);
    expect(problems(lines.join("\n"), 4)).toContain("calibration not between regulator on and enable");
  });
  it("planted fault: CKMODE written after enable is caught", () => {
    const lines = header.split("\n");
    const ck = lines.findIndex((l) => l.includes("ADC_CFGR2 = "));
    const [ckLine] = lines.splice(ck, 1);
    const en = lines.findIndex((l) => l.includes("ADC_CR |= ADC_CR_ADEN;"));
    lines.splice(en + 1, 0, ckLine);
    expect(problems(lines.join("\n"), 4)).toContain("CKMODE written after ADEN");
  });
  it("refuses the timing output's own pin as the ADC input", () => {
    expect(() => renderStm32g031Adc({ table, channel: 3, controlText: "" })).toThrow(/channel/);
  });
});
