// Request checks for the start of a plan (engine.md section 6): start, delayS,
// edge and retrigger. Free-running requests pass through unchanged.
import { EngineError } from "../errors";
import type { InputEdge, PlanRequest, PlanStart, RetriggerRule } from "../plan-types";

export interface CheckedStart {
  start: PlanStart;
  delayS: number;
  edge: InputEdge;
  retrigger: RetriggerRule;
}

const STARTS: readonly PlanStart[] = ["free", "trigger", "zero-cross"];
const EDGES: readonly InputEdge[] = ["rising", "falling", "both"];
const RETRIGGER: readonly RetriggerRule[] = ["ignore", "restart"];

function oneOf<T extends string>(value: unknown, allowed: readonly T[], field: string, what: string): T {
  if (!allowed.includes(value as T))
    throw new EngineError(
      "invalid-request",
      `${field} (${what}) must be one of ${allowed.join(", ")}, got ${JSON.stringify(value)}.`,
      field,
    );
  return value as T;
}

export function checkStart(request: PlanRequest, periodS: number, activeS: number): CheckedStart {
  const start =
    request.start === undefined ? "free" : oneOf(request.start, STARTS, "start", "how the output starts");
  if (start === "free") {
    for (const f of ["delayS", "edge", "retrigger"] as const) {
      if (request[f] !== undefined)
        throw new EngineError(
          "invalid-request",
          `${f} applies only to a triggered start ("trigger" or "zero-cross"); this plan is free-running.`,
          f,
        );
    }
    return { start, delayS: 0, edge: "rising", retrigger: "ignore" };
  }
  const delayS = request.delayS ?? 0;
  if (typeof delayS !== "number" || !Number.isFinite(delayS) || delayS < 0)
    throw new EngineError(
      "invalid-request",
      `delayS (delay from the input edge to the pulse) must be a finite number of seconds, 0 or more, got ${String(delayS)}.`,
      "delayS",
    );
  if (delayS + activeS >= periodS)
    throw new EngineError(
      "invalid-request",
      `delayS ${delayS} s plus the pulse ${activeS} s must end before the next input edge (periodS ${periodS} s${start === "zero-cross" ? ", the half cycle" : ""}).`,
      "delayS",
    );
  const edge =
    request.edge === undefined
      ? start === "zero-cross"
        ? "both"
        : "falling"
      : oneOf(request.edge, EDGES, "edge", "which input edge starts the delay");
  if (start === "zero-cross" && request.retrigger !== undefined)
    throw new EngineError(
      "invalid-request",
      "retrigger applies to a trigger start; zero crossings come once per half cycle.",
      "retrigger",
    );
  const retrigger =
    request.retrigger === undefined
      ? "ignore"
      : oneOf(request.retrigger, RETRIGGER, "retrigger", "what a trigger does while the pulse runs");
  return { start, delayS, edge, retrigger };
}
