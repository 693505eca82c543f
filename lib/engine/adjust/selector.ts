// The target side of a selector switch: one timer setting per switch
// position, read from input pins (one pin per position, pulled up, the
// switch's common contact to ground: the selected position reads low).
// Every position uses the same timer divider (commonDividerPlan), so a
// change of position changes only TOP and compare.
import { EngineError } from "../errors";
import { analyzeStage, validateStage } from "../analyze-stage";
import type { Stage } from "../stage-types";
import type { TimerPlan } from "../plan-types";
import { commonDividerPlan, type TablePlanRequest } from "./adc-table";
import { stageAt, validateControl } from "./travel";

export interface SelectorPosition {
  /** 1-based, as printed on the switch */
  position: number;
  value: number;
  wantS: number;
  wantHighS: number;
  periodCounts: number;
  highCounts: number;
  periodS: number;
  errorPpm: number;
}

export interface SelectorTable {
  plan: TimerPlan;
  /** input pins needed: one per position */
  inputPins: number;
  positions: SelectorPosition[];
  /** what the firmware does when no pin or more than one reads low (a switch between contacts) */
  noContactRule: string;
}

export function buildSelectorTable(
  req: TablePlanRequest & { stage: Stage; control: unknown },
): SelectorTable {
  const stage = validateStage(req.stage);
  const control = validateControl(stage, req.control);
  if (control.kind !== "selector")
    throw new EngineError(
      "invalid-request",
      'control.kind must be "selector" for a selector table.',
      "control.kind",
    );
  const want = control.values.map((value, i) => {
    const a = analyzeStage(stageAt(stage, control, i), { samples: 1 });
    if (!a.oscillates)
      throw new EngineError(
        "invalid-request",
        `Selector position ${i + 1} (${control.field} = ${value}) does not run: ${a.checks.find((c) => c.level === "error")?.message ?? ""}`,
        `control.values.${i}`,
      );
    return { value, periodS: a.periodS, highS: a.highS };
  });
  const longest = want.reduce((m, w) => (w.periodS > m.periodS ? w : m), want[0]);
  const { plan, tick } = commonDividerPlan(req, longest);
  const positions = want.map((w, i) => {
    const periodCounts = Math.max(2, Math.round(w.periodS / tick));
    const highCounts = Math.min(periodCounts - 1, Math.max(1, Math.round(w.highS / tick)));
    const periodS = periodCounts * tick;
    return {
      position: i + 1,
      value: w.value,
      wantS: w.periodS,
      wantHighS: w.highS,
      periodCounts,
      highCounts,
      periodS,
      errorPpm: ((periodS - w.periodS) / w.periodS) * 1e6,
    };
  });
  return {
    plan,
    inputPins: positions.length,
    positions,
    noContactRule:
      "While no position or more than one reads low (the switch between contacts), the output keeps the last position's timing.",
  };
}
