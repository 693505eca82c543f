// A target: device, clock source and frequency, mode, timer and the period
// tolerance the new board must hold. Checked against the engine's device
// catalogue so a wrong clock option or timer is a field error, not a 500.
// Built with "zod/mini": the workspace form validates with it in the browser.
import * as z from "zod/mini";
import type { core } from "zod/mini";
import { clockChoiceProblem, listDevices, type DeviceInfo } from "@/lib/engine";
import { engNumber, optionalEngNumber } from "./eng";
import { formText } from "./form-text";
import { optionalPlainNumber } from "./plain-number";
import { plainMessage } from "./plain-message";

const DEVICES = listDevices();
export const DEVICE_IDS = DEVICES.map((d) => d.id) as [string, ...string[]];
export const TIMER_MODES = ["pwm", "toggle", "isr"] as const;
export const PLAN_STARTS = ["free", "trigger", "zero-cross"] as const;
export const INPUT_EDGES = ["rising", "falling", "both"] as const;
export const RETRIGGER_RULES = ["ignore", "restart"] as const;

export function deviceById(id: string): DeviceInfo | undefined {
  return DEVICES.find((d) => d.id === id);
}

const blankToUndefined = (v: unknown) => (v === "" || v === null ? undefined : v);
/**
 * Blank ("" or null) is missing, then `schema`: classic zod's preprocess, which
 * zod/mini lacks. The same pipe at run time; the type says, as the preprocess
 * type does, that the key may be left out (the transform's input is optional).
 */
function blankOr<T extends core.SomeType>(schema: T) {
  const inner: core.$ZodType = z.optional(schema);
  return z.pipe(z.transform<unknown, unknown>(blankToUndefined), inner) as unknown as core.$ZodPreprocess<
    z.ZodMiniOptional<T>
  >;
}

export const targetSchema = z
  .object({
    device: z.enum(DEVICE_IDS, { error: `Choose a device: ${DEVICE_IDS.join(", ")}.` }),
    clockSource: z
      .string({ error: "Choose a clock source." })
      .check(z.trim(), z.minLength(1, "Choose a clock source.")),
    clockHz: engNumber("Hz", { positive: true }),
    clockAccuracyPpm: optionalPlainNumber(
      "Clock accuracy is a number in ppm",
      z.number().check(z.gte(0, "Must not be negative.")),
    ),
    mode: blankOr(z.enum(TIMER_MODES, { error: "Mode is pwm, toggle or isr." })),
    timer: blankOr(z.string().check(z.trim(), z.maxLength(20))),
    pin: blankOr(z.string().check(z.trim(), z.maxLength(20))),
    activeLow: z._default(z.optional(z.boolean()), false),
    requiredTolerancePct: optionalPlainNumber(
      "Required tolerance is a number in percent",
      z.number().check(z.gt(0, "Must be greater than 0 %."), z.lte(100, "At most 100 %.")),
    ),
    // How the output starts (engine.md section 6). Blank = by the stage: a
    // synchronised stage follows the zero crossings, a 555 one-shot a trigger.
    start: blankOr(z.enum(PLAN_STARTS, { error: "Start is free, trigger or zero-cross." })),
    /** Input edge to pulse; blank = the stage's firing delay (or 0). */
    delayS: z.optional(optionalEngNumber("s")),
    /** Output pulse width of a triggered start; blank = the old stage's pulse. */
    pulseS: z.optional(optionalEngNumber("s", { positive: true })),
    /** Shortest time between triggers; blank = twice delay plus pulse (closer triggers are ignored). */
    minIntervalS: z.optional(optionalEngNumber("s", { positive: true })),
    edge: blankOr(z.enum(INPUT_EDGES, { error: "Input edge is rising, falling or both." })),
    retrigger: blankOr(z.enum(RETRIGGER_RULES, { error: "Retrigger is ignore or restart." })),
    // Gate-drive needs, part of the budget verdict.
    gateMinS: z.optional(optionalEngNumber("s", { positive: true })),
    gateMaxS: z.optional(optionalEngNumber("s", { positive: true })),
    gateTrainPeriodS: z.optional(optionalEngNumber("s", { positive: true })),
    gateTrainPulses: optionalPlainNumber(
      "Pulses in the train is a whole number",
      z
        .int({ error: "Pulses in the train is a whole number." })
        .check(z.gte(2, "A train has at least 2 pulses."), z.lte(1000, "At most 1000 pulses.")),
    ),
  })
  .check(
    z.superRefine((t, ctx) => {
      const free = t.start === undefined || t.start === "free";
      if (t.start === "free") {
        for (const f of ["delayS", "pulseS", "minIntervalS", "edge", "retrigger"] as const) {
          if (t[f] !== undefined)
            ctx.addIssue({ code: "custom", path: [f], message: "Only for a trigger or zero-cross start." });
        }
      }
      if (!free && t.delayS !== undefined && t.delayS < 0)
        ctx.addIssue({ code: "custom", path: ["delayS"], message: "Delay must not be negative." });
      if (t.start === "zero-cross" && t.retrigger !== undefined)
        ctx.addIssue({
          code: "custom",
          path: ["retrigger"],
          message: "Zero crossings come once per half cycle: retrigger is for a trigger start.",
        });
      if (t.gateMinS !== undefined && t.gateMaxS !== undefined && t.gateMinS > t.gateMaxS)
        ctx.addIssue({
          code: "custom",
          path: ["gateMinS"],
          message: "Minimum gate pulse must not be above the maximum.",
        });
      if ((t.gateTrainPeriodS === undefined) !== (t.gateTrainPulses === undefined))
        ctx.addIssue({
          code: "custom",
          path: [t.gateTrainPeriodS === undefined ? "gateTrainPeriodS" : "gateTrainPulses"],
          message: "A pulse train needs both its period and its number of pulses.",
        });
      const device = deviceById(t.device);
      if (!device) return;
      // The engine's own rule (planTarget applies the same), so the form, the
      // API and generation refuse the same clock choices with the same words.
      const clock = clockChoiceProblem({ device: t.device, clockSource: t.clockSource, clockHz: t.clockHz });
      if (clock) ctx.addIssue({ code: "custom", path: [clock.field], message: plainMessage(clock.message) });
      if (t.timer && !device.timers.some((x) => x.name === t.timer!.toUpperCase())) {
        ctx.addIssue({
          code: "custom",
          path: ["timer"],
          message: `${device.name} has no timer "${t.timer}"; one of ${device.timers.map((x) => x.name).join(", ")}.`,
        });
      }
      if (t.mode && t.timer) {
        const timer = device.timers.find((x) => x.name === t.timer!.toUpperCase());
        if (timer && !timer.modes.includes(t.mode)) {
          ctx.addIssue({ code: "custom", path: ["mode"], message: `${timer.name} has no ${t.mode} mode.` });
        }
      }
    }),
  );

export type TargetInput = z.input<typeof targetSchema>;
export type Target = z.output<typeof targetSchema>;

export const targetsSchema = z.array(targetSchema).check(z.maxLength(8, "At most 8 targets per retrofit."));

/** Form text for a new target row: the device's first clock at its fixed or top frequency. */
export function defaultTarget(deviceId = "atmega328p"): TargetInput {
  const device = deviceById(deviceId) ?? DEVICES[0];
  const clock = device.clocks[0];
  return {
    device: device.id,
    clockSource: clock.id,
    // Written as the form writes numbers ("16M"), never rewritten to digits.
    clockHz: formText(clock.hz ?? Math.min(clock.maxHz ?? device.maxClockHz, 16e6)),
    mode: "pwm",
    timer: "",
    requiredTolerancePct: "1",
    activeLow: false,
  };
}

/** Names of a target's form fields: an engine refusal naming one of them marks that field. */
export const TARGET_FIELDS: ReadonlySet<string> = new Set(Object.keys(targetSchema.shape));
