// Runs a triggered or zero-cross RP2040 image in rp2040js with the input GPIO
// driven from a list of timed levels (rp2040js GPIOPin.setInputValue), and
// pairs each input edge with the output pulse that follows it. Times are
// turned into clk_sys cycles of the plan.
import { buildBundleSources, type BundleTargetRequest } from "@/lib/bundle";
import { planTarget, type TimerPlan } from "@/lib/engine";
import { buildRp2040, type SourceEdit } from "./rp2040-build";
import { bootAndRun, type Edge } from "@/lib/firmware/emulate/harness/rp2040-boot";
import { elfFlashContent } from "./rp2040-image-readers";

export interface InputStep {
  ns: number;
  high: boolean;
}

export interface TriggerRunRp {
  plan: TimerPlan;
  inputs: InputStep[];
  edges: Edge[];
}

/** Square wave on the input: first change at firstNs, then every halfNs, `count` changes. */
export function squareWave(firstNs: number, halfNs: number, count: number): InputStep[] {
  return Array.from({ length: count }, (_, i) => ({ ns: firstNs + i * halfNs, high: i % 2 === 0 }));
}

export function runRp2040Trigger(
  target: BundleTargetRequest & Record<string, unknown>,
  inputs: InputStep[],
  edits: SourceEdit[] = [],
): TriggerRunRp {
  const files = buildBundleSources({
    retrofit: { name: "Trigger proof" },
    revision: 1,
    stage: { kind: "timer555-monostable", r: 10e3, c: 1e-6 },
    targets: [target],
  });
  const plan = planTarget(target as never) as TimerPlan;
  const flash = elfFlashContent(buildRp2040(files, "rp2040", edits).elf).bytes;
  const inGpio = plan.input!.gpio!;
  const last = inputs[inputs.length - 1].ns;
  const run = bootAndRun(new Uint8Array(flash), {
    gpio: plan.pin.gpio!,
    edgesWanted: Number.MAX_SAFE_INTEGER,
    maxNs: last + 2 * (plan.delayS! + plan.highS) * 1e9 + 1e6,
    setup: (rp) => {
      let i = 0;
      const alarm = rp.clock.createAlarm(() => {
        rp.gpio[inGpio].setInputValue(inputs[i].high);
        i++;
        if (i < inputs.length) alarm.schedule(inputs[i].ns - inputs[i - 1].ns);
      });
      alarm.schedule(inputs[0].ns);
    },
  });
  return { plan, inputs, edges: run.edges };
}

export interface PulseAfter {
  /** input edge time, ns */
  at: number;
  /** in clk_sys cycles; NaN when no pulse followed */
  delayCycles: number;
  widthCycles: number;
}

/** The first output pulse (leading edge = the active level) after each input step in `from`. */
export function pulsesAfterRp(r: TriggerRunRp, from: InputStep[]): PulseAfter[] {
  const on = r.plan.activeLow !== true;
  const toCycles = (ns: number) => (ns * r.plan.clockHz) / 1e9;
  const firstInput = r.inputs[0].ns;
  const out = r.edges.filter((e) => e.ns >= firstInput); // boot-time pin changes are not pulses
  return from.map((s) => {
    const i = out.findIndex((e) => e.ns >= s.ns && e.high === on);
    const end = i >= 0 ? out.slice(i + 1).find((e) => e.high !== on) : undefined;
    return {
      at: s.ns,
      delayCycles: i >= 0 ? toCycles(out[i].ns - s.ns) : NaN,
      widthCycles: i >= 0 && end ? toCycles(end.ns - out[i].ns) : NaN,
    };
  });
}

/** Output leading edges after the first input step. */
export function leadingEdges(r: TriggerRunRp): Edge[] {
  const on = r.plan.activeLow !== true;
  return r.edges.filter((e) => e.ns >= r.inputs[0].ns && e.high === on);
}

/** Pulses outside delayCounts*n within one count (minus) / one count plus latencyCycles (plus), width within one count. */
export function badPulses(plan: TimerPlan, pulses: PulseAfter[]): PulseAfter[] {
  const n = plan.divider;
  const wantDelay = plan.delayCounts! * n;
  const wantWidth = plan.highCounts * n;
  return pulses.filter(
    (p) =>
      !(p.delayCycles >= wantDelay - n && p.delayCycles <= wantDelay + n + plan.latencyCycles!) ||
      !(Math.abs(p.widthCycles - wantWidth) <= n),
  );
}
