// A kept control in the bundle: when the stage has a rate potentiometer, the
// targets with ADC firmware read it (engine ADC table, the old stage's own law)
// instead of holding one fixed period. This file decides per target what the
// bundle gets: the firmware part, the pot's wiring for the pin map, the
// checklist lines at minimum/middle/maximum and the plan.json entry.
import {
  buildAdcTable,
  buildSelectorTable,
  EngineError,
  isEngineError,
  travelChecklist,
  type AdcTable,
  type SelectorTable,
  type StageControl,
  type TimerPlan,
} from "@/lib/engine";
import { formatEng } from "@/lib/engine/units";
import {
  ATMEGA328P_POT_WIRING,
  ATTINY85_POT_WIRING,
  renderAtmega328pAdc,
  renderAttiny85Adc,
} from "./adc-avr";
import { MSP430G2553_POT_WIRING, renderMsp430g2553Adc } from "./adc-msp430g2553";
import { PIC12F1840_POT_WIRING, renderPic12f1840Adc } from "./adc-pic12f1840";
import { renderRp2040Adc, RP2040_POT_WIRING } from "./adc-rp2040";
import {
  atmega328pSelectorWiring,
  attiny85SelectorWiring,
  renderAtmega328pSelector,
  renderAttiny85Selector,
} from "./selector-avr";
import { SELECTOR_DEBOUNCE_MS } from "./selector-common";
import { renderStm32g031Adc, STM32G031_POT_WIRING } from "./adc-stm32g031";
import { renderRp2040Selector, rp2040SelectorWiring } from "./selector-rp2040";
import { renderStm32g031Selector, stm32g031SelectorWiring } from "./selector-stm32g031";
import { msp430g2553SelectorWiring, renderMsp430g2553Selector } from "./selector-msp430g2553";
import { pic12f1840SelectorWiring, renderPic12f1840Selector } from "./selector-pic12f1840";
import { ppm } from "./format";
import type { BundleSpec, BundleTargetRequest } from "./types";
import { TRIM_DEVICES, type TrimmerSummary } from "./trim-control";

/** Table entries over the travel: 64 steps of a 10-bit ADC are 16 counts each, room for the hysteresis. */
export const KEPT_STEPS = 64;

interface AdcDevice {
  adcBits: 10 | 12;
  timer?: string;
  wiring: readonly { role: string; pin: string; packagePin: number }[];
  /** output paths under the target folder -> rendered parts */
  part: (table: AdcTable, controlText: string) => { path: string; content: string }[];
}

const ADC_DEVICES: Record<string, AdcDevice> = {
  atmega328p: {
    adcBits: 10,
    timer: "TIMER1",
    wiring: ATMEGA328P_POT_WIRING,
    // a whole program: it takes main.c's place
    part: (table, controlText) => [
      {
        path: "src/main.c",
        content: renderAtmega328pAdc({ table, controlText }),
      },
    ],
  },
  attiny85: {
    adcBits: 10,
    timer: "TIMER0",
    wiring: ATTINY85_POT_WIRING,
    part: (table, controlText) => [
      {
        path: "src/main.c",
        content: renderAttiny85Adc({ table, controlText }),
      },
    ],
  },
  stm32g031: {
    adcBits: 12,
    wiring: STM32G031_POT_WIRING,
    part: (table, controlText) => [
      {
        path: "src/adc_control.h",
        content: renderStm32g031Adc({ table, controlText }),
      },
    ],
  },
  pic12f1840: {
    adcBits: 10,
    timer: "TIMER2",
    wiring: PIC12F1840_POT_WIRING,
    // the image's assembly part (main.asm includes it) and the same steps in C (main.c includes it)
    part: (table, controlText) => {
      const { asm, c } = renderPic12f1840Adc({ table, controlText });
      return [
        { path: "src/adc_control.inc", content: asm },
        { path: "src/adc_control.h", content: c },
      ];
    },
  },
  msp430g2553: {
    adcBits: 10,
    wiring: MSP430G2553_POT_WIRING,
    part: (table, controlText) => [
      {
        path: "src/adc_control.h",
        content: renderMsp430g2553Adc({ table, controlText }),
      },
    ],
  },
  rp2040: {
    adcBits: 12,
    wiring: RP2040_POT_WIRING,
    // a header main.c includes (main.c.hbs, `adc`)
    part: (table, controlText) => [
      {
        path: "src/adc_control.h",
        content: renderRp2040Adc({ table, controlText }),
      },
    ],
  },
};

/** A checklist line of a kept control: expected period and its pass limits. */
export interface ControlCheckLine {
  instruction: string;
  expectedS: number;
  minS: number;
  maxS: number;
}

export interface PotSummary {
  kind: "pot";
  field: string;
  adcBits: number;
  steps: number;
  countsPerStep: number;
  hysteresisCounts: number;
  worstStepPpm: number;
  worstErrorPpm: number;
  periodCounts: number[];
  highCounts: number[];
}

export interface SelectorSummary {
  kind: "selector";
  field: string;
  /** the table's timer divider and clock (the firmware's; the target's own plan may differ) */
  divider: number;
  clockHz: number;
  positions: number;
  debounceMs: number;
  values: number[];
  periodCounts: number[];
  highCounts: number[];
  worstErrorPpm: number;
}

export interface KeptControl {
  /** the table's plan: its timer, mode and pin hold for every step or position */
  table: { plan: TimerPlan };
  /** steps (pot) or positions (selector) */
  count: number;
  /** headings of the pin map and checklist sections */
  titles: { wiring: string; checks: string; intro: string };
  files: { path: string; content: string }[];
  wiring: { role: string; pin: string; packagePin: number }[];
  lines: ControlCheckLine[];
  /** plan.json entry */
  summary: PotSummary | SelectorSummary | TrimmerSummary;
}

export type ControlOnTarget = { kept: true; control: KeptControl } | { kept: false; note: string } | null;

function describe(c: StageControl): string {
  if (c.kind === "selector") return `selector on ${c.field}`;
  const taper = c.kind === "pot" ? `, ${c.taper}` : "";
  return `${c.kind} as ${c.field}, ${c.trackR} ohm track${taper} + ${c.seriesR} ohm in series`;
}

/** What target `index` does with the stage's control; null when the stage has none. */
export function controlOnTarget(
  spec: BundleSpec,
  request: BundleTargetRequest,
  index: number,
): ControlOnTarget {
  const c = spec.control;
  if (!c) return null;
  // a trimmer on these devices is the calibration constant: build.ts asks trimOnTarget (trim-control.ts)
  if (c.kind === "trimmer" && TRIM_DEVICES.has(request.device)) return null;
  if (c.kind === "selector" && SELECTOR_DEVICES[request.device])
    return selectorOnTarget(spec, request, index, c);
  const dev = ADC_DEVICES[request.device];
  if (c.kind !== "pot" || !dev)
    return {
      kept: false,
      note:
        c.kind !== "pot"
          ? `The old board's ${c.kind} on ${c.field} is not carried over by this firmware: it runs at the stored value of ${c.field}.`
          : `The ${request.device} firmware does not read the rate pot yet: it runs at the stored value of ${c.field}.`,
    };
  let table: AdcTable;
  try {
    table = buildAdcTable({
      stage: spec.stage,
      control: c,
      device: request.device,
      clockHz: request.clockHz,
      clockSource: request.clockSource,
      timer: dev.timer,
      adcBits: dev.adcBits,
      steps: KEPT_STEPS,
    });
  } catch (e) {
    const why = e instanceof Error ? e.message : String(e);
    throw new EngineError(
      isEngineError(e) ? e.code : "invalid-request",
      `target ${index + 1} (${request.device}) cannot keep the rate pot: ${why}`,
      `targets.${index}`,
    );
  }
  return {
    kept: true,
    control: {
      table,
      count: table.steps.length,
      titles: {
        wiring: "Rate pot wiring (the old board's control, kept)",
        checks: `Rate pot checks (the kept control: ${table.steps.length} steps, worst step ${ppm(table.worstStepPpm)})`,
        intro:
          "The fixed-period lines above hold with the pot where the old board was set; these check its travel.",
      },
      files: dev.part(table, describe(c)),
      wiring: dev.wiring.map((w) => ({ ...w })),
      lines: travelChecklist(table),
      summary: {
        kind: "pot",
        field: c.field,
        adcBits: table.adcBits,
        steps: table.steps.length,
        countsPerStep: table.countsPerStep,
        hysteresisCounts: table.hysteresisCounts,
        worstStepPpm: table.worstStepPpm,
        worstErrorPpm: table.worstErrorPpm,
        periodCounts: table.steps.map((s) => s.periodCounts),
        highCounts: table.steps.map((s) => s.highCounts),
      },
    },
  };
}

type SelectorControl = Extract<StageControl, { kind: "selector" }>;

interface SelectorDevice {
  timer?: string;
  wiring: (table: SelectorTable, valueText: (v: number) => string) => KeptControl["wiring"];
  part: (
    table: SelectorTable,
    startIndex: number,
    controlText: string,
  ) => { path: string; content: string }[];
}

/** Devices whose firmware reads a selector switch on input pins. */
const SELECTOR_DEVICES: Record<string, SelectorDevice> = {
  atmega328p: {
    timer: "TIMER1",
    wiring: atmega328pSelectorWiring,
    // a whole program: it takes main.c's place
    part: (table, startIndex, controlText) => [
      { path: "src/main.c", content: renderAtmega328pSelector({ table, startIndex, controlText }) },
    ],
  },
  attiny85: {
    timer: "TIMER0",
    wiring: attiny85SelectorWiring,
    part: (table, startIndex, controlText) => [
      { path: "src/main.c", content: renderAttiny85Selector({ table, startIndex, controlText }) },
    ],
  },
  msp430g2553: {
    wiring: msp430g2553SelectorWiring,
    part: (table, startIndex, controlText) => [
      {
        path: "src/selector_control.h",
        content: renderMsp430g2553Selector({ table, startIndex, controlText }),
      },
    ],
  },
  stm32g031: {
    wiring: stm32g031SelectorWiring,
    part: (table, startIndex, controlText) => [
      {
        path: "src/selector_control.h",
        content: renderStm32g031Selector({ table, startIndex, controlText }),
      },
    ],
  },
  pic12f1840: {
    timer: "TIMER2",
    wiring: pic12f1840SelectorWiring,
    // the image's assembly part (main.asm includes it) and the same steps in C (main.c includes it)
    part: (table, startIndex, controlText) => {
      const { asm, c } = renderPic12f1840Selector({ table, startIndex, controlText });
      return [
        { path: "src/selector_control.inc", content: asm },
        { path: "src/selector_control.h", content: c },
      ];
    },
  },
  rp2040: {
    wiring: rp2040SelectorWiring,
    // a header main.c includes (main.c.hbs, `selector`)
    part: (table, startIndex, controlText) => [
      {
        path: "src/selector_control.h",
        content: renderRp2040Selector({ table, startIndex, controlText }),
      },
    ],
  },
};

function selectorOnTarget(
  spec: BundleSpec,
  request: BundleTargetRequest,
  index: number,
  c: SelectorControl,
): ControlOnTarget {
  const dev = SELECTOR_DEVICES[request.device];
  let table: SelectorTable;
  try {
    table = buildSelectorTable({
      stage: spec.stage,
      control: c,
      device: request.device,
      clockHz: request.clockHz,
      clockSource: request.clockSource,
      timer: dev.timer,
    });
  } catch (e) {
    const why = e instanceof Error ? e.message : String(e);
    throw new EngineError(
      isEngineError(e) ? e.code : "invalid-request",
      `target ${index + 1} (${request.device}) cannot keep the selector: ${why}`,
      `targets.${index}`,
    );
  }
  const plan = table.plan;
  // stage fields name their unit by their last letter in plain words: a capacitance ends in "c" or "C"
  const valueText = (v: number) => `${c.field} = ${formatEng(v, /c$/i.test(c.field) ? "F" : "ohm")}`;
  const stored = (spec.stage as unknown as Record<string, number>)[c.field];
  const startIndex = Math.max(
    0,
    c.values.findIndex((v) => v === stored),
  );
  // pass limits: the checklist's rule for the fixed lines (clock accuracy, jitter, one timer count)
  const countS = (plan.divider * plan.modeFactor) / plan.clockHz;
  const widen = (v: number) => v * plan.clockAccuracyPpm * 1e-6 + (plan.jitterS ?? 0) + countS;
  const lines = table.positions.map((p) => ({
    instruction: `Turn the selector to position ${p.position} (${valueText(p.value)}), wait a moment and measure the period.`,
    expectedS: p.periodS,
    minS: p.periodS - widen(p.periodS),
    maxS: p.periodS + widen(p.periodS),
  }));
  let files: { path: string; content: string }[];
  try {
    files = dev.part(table, startIndex, describe(c));
  } catch (e) {
    // The part's own limits (pins, positions, clock): control.* stays, a target field is named under
    // targets.<i>. The renderers state a plain "control.values: ..." or "targets: ..." limit as an Error;
    // it is bad input too (a 4xx naming the field), never a server error.
    const plain =
      !isEngineError(e) && e instanceof Error ? /^(control(?:\.\w+)?|targets):\s*/.exec(e.message) : null;
    if (!isEngineError(e) && !plain) throw e;
    const named = isEngineError(e)
      ? e.field
      : plain![1] === "targets"
        ? undefined
        : plain![1] === "control"
          ? "control.values"
          : plain![1];
    const message = isEngineError(e) ? e.message : (e as Error).message.slice(plain![0].length);
    const field = named?.startsWith("control.") ? named : `targets.${index}${named ? `.${named}` : ""}`;
    throw new EngineError(
      isEngineError(e) ? e.code : "invalid-request",
      `target ${index + 1} (${request.device}) cannot keep the selector: ${message}`,
      field,
    );
  }
  return {
    kept: true,
    control: {
      table,
      count: table.positions.length,
      titles: {
        wiring: "Selector switch wiring (the old board's control, kept)",
        checks: `Selector checks (the kept control: ${table.positions.length} positions, one line each)`,
        intro: `The fixed-period lines above hold at the position of the stored value; these check every position. ${table.noContactRule}`,
      },
      files,
      wiring: dev.wiring(table, valueText),
      lines,
      summary: {
        kind: "selector",
        field: c.field,
        divider: plan.divider,
        clockHz: plan.clockHz,
        positions: table.positions.length,
        debounceMs: SELECTOR_DEBOUNCE_MS,
        values: table.positions.map((p) => p.value),
        periodCounts: table.positions.map((p) => p.periodCounts),
        highCounts: table.positions.map((p) => p.highCounts),
        worstErrorPpm: Math.max(...table.positions.map((p) => Math.abs(p.errorPpm))),
      },
    },
  };
}
