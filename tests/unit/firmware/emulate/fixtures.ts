// Builds one target the way the worker does (buildBundleFiles: sources and the
// images from the bundle's own Makefile) and, for planted faults, the same
// target with one source line changed and its images rebuilt.
import { expect } from "vitest";
import { buildBundleFiles, textOf, type BundleFile, type BundleTargetRequest } from "@/lib/bundle";
import { buildTargetImages } from "@/lib/firmware/build-images";
import { emulateTarget } from "@/lib/firmware/emulate";
import { emulationInputOf } from "@/lib/firmware/emulate/plan-input";
import type { EmulationInput } from "@/lib/firmware/emulate/types";
import { planTarget, type TimerPlan } from "@/lib/engine";
import { spec } from "@/tests/unit/bundle/fixtures";

export async function built(request: BundleTargetRequest) {
  const plan = planTarget(request as never) as TimerPlan;
  const files = await buildBundleFiles(spec([request]));
  return { plan, files };
}

/** The folder's sources with `edit` applied to `file` (default src/main.c; must change something), images rebuilt. */
export async function withFault(
  files: BundleFile[],
  folder: string,
  device: string,
  edit: (source: string) => string,
  file = "src/main.c",
): Promise<BundleFile[]> {
  const sources = files
    .filter((f) => !f.path.includes("/firmware/"))
    .map((f) => {
      if (f.path !== `${folder}/${file}`) return f;
      const after = edit(textOf(f));
      if (after === textOf(f)) throw new Error("the planted fault changed nothing");
      return { ...f, content: after };
    });
  return [...sources, ...(await buildTargetImages(sources, folder, device))];
}

export function inputFor(plan: TimerPlan, files: BundleFile[], folder = plan.device): EmulationInput {
  return emulationInputOf(plan, folder, files);
}

/**
 * Builds a triggered or zero-cross target, runs the product's wrapper and checks the shared contract
 * (firmware.md, judge-trigger.ts): "agrees" over 3 pulses, delay within one count below and one count
 * plus the plan's stated latency above, width within one count, each widened by the emulator's step
 * (`stepS`: one CPU cycle, or one instruction cycle on the PIC), and the named input driven.
 */
export async function expectTriggerAgrees(
  request: BundleTargetRequest,
  opts: { input?: string; stepS?: (plan: TimerPlan) => number } = {},
): Promise<void> {
  const { plan, files } = await built(request);
  const r = await emulateTarget(inputFor(plan, files));
  expect(r.reason).toMatch(/^Agrees over 3 /);
  expect(r.verdict).toBe("agrees");
  const count = plan.divider / plan.clockHz;
  const step = opts.stepS ? opts.stepS(plan) : 1 / plan.clockHz;
  expect(r.delayS!).toBeGreaterThanOrEqual(plan.delayS! - count - step);
  expect(r.delayS!).toBeLessThanOrEqual(plan.delayS! + count + plan.latencyS! + step);
  expect(Math.abs(r.widthS! - plan.highS)).toBeLessThanOrEqual(count + step);
  expect(r.trigger!.input).toBe(opts.input ?? plan.input!.port);
}
