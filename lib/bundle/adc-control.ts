// A kept control in the bundle: when the stage has a rate potentiometer, the
// targets with ADC firmware read it (engine ADC table, the old stage's own law)
// instead of holding one fixed period. This file decides per target what the
// bundle gets: the firmware part, the pot's wiring for the pin map, the
// checklist lines at minimum/middle/maximum and the plan.json entry.
import {
  buildAdcTable,
  EngineError,
  isEngineError,
  travelChecklist,
  type AdcTable,
  type StageControl,
  type TravelCheckLine,
} from "@/lib/engine";
import {
  ATMEGA328P_POT_WIRING,
  ATTINY85_POT_WIRING,
  renderAtmega328pAdc,
  renderAttiny85Adc,
} from "./adc-avr";
import { renderRp2040Adc, RP2040_POT_WIRING } from "./adc-rp2040";
import { renderStm32g031Adc, STM32G031_POT_WIRING } from "./adc-stm32g031";
import type { BundleSpec, BundleTargetRequest } from "./types";

/** Table entries over the travel: 64 steps of a 10-bit ADC are 16 counts each, room for the hysteresis. */
export const KEPT_STEPS = 64;

interface AdcDevice {
  adcBits: 10 | 12;
  timer?: string;
  wiring: readonly { role: string; pin: string; packagePin: number }[];
  /** output path under the target folder -> rendered part */
  part: (table: AdcTable, controlText: string) => { path: string; content: string };
}

const ADC_DEVICES: Record<string, AdcDevice> = {
  atmega328p: {
    adcBits: 10,
    timer: "TIMER1",
    wiring: ATMEGA328P_POT_WIRING,
    // a whole program: it takes main.c's place
    part: (table, controlText) => ({
      path: "src/main.c",
      content: renderAtmega328pAdc({ table, controlText }),
    }),
  },
  attiny85: {
    adcBits: 10,
    timer: "TIMER0",
    wiring: ATTINY85_POT_WIRING,
    part: (table, controlText) => ({
      path: "src/main.c",
      content: renderAttiny85Adc({ table, controlText }),
    }),
  },
  stm32g031: {
    adcBits: 12,
    wiring: STM32G031_POT_WIRING,
    part: (table, controlText) => ({
      path: "src/adc_control.h",
      content: renderStm32g031Adc({ table, controlText }),
    }),
  },
  rp2040: {
    adcBits: 12,
    wiring: RP2040_POT_WIRING,
    // a header main.c includes (main.c.hbs, `adc`)
    part: (table, controlText) => ({
      path: "src/adc_control.h",
      content: renderRp2040Adc({ table, controlText }),
    }),
  },
};

export interface KeptControl {
  table: AdcTable;
  file: { path: string; content: string };
  wiring: { role: string; pin: string; packagePin: number }[];
  lines: TravelCheckLine[];
  /** plan.json entry */
  summary: {
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
  };
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
      file: dev.part(table, describe(c)),
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
