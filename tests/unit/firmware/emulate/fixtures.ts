// Builds one target the way the worker does (buildBundleFiles: sources and the
// images from the bundle's own Makefile) and, for planted faults, the same
// target with one source line changed and its images rebuilt.
import { buildBundleFiles, textOf, type BundleFile, type BundleTargetRequest } from "@/lib/bundle";
import { buildTargetImages } from "@/lib/firmware/build-images";
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
