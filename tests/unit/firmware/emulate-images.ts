// Real images for the emulator wrapper tests: a one-target bundle rendered by
// the product (buildBundleSources) and built by the product's image builder
// (lib/firmware/build-images.ts, the bundle's own Makefile). A planted fault
// edits one source file before the build; the planned numbers stay the
// request's, so the image built from the edited source must be caught.
import { buildBundleSources, type BundlePlan, type BundleTargetRequest } from "@/lib/bundle";
import { buildTargetImages } from "@/lib/firmware/build-images";
import type { EmulationInput } from "@/lib/firmware/emulate/types";

export interface Plant {
  /** Path inside the target folder, e.g. "src/main.c". */
  file: string;
  from: string | RegExp;
  to: string;
}

export interface TargetImage {
  plan: BundlePlan;
  /** Input for the wrapper: the request's period and high time as planned, half a count as tolerance. */
  input: EmulationInput;
}

export async function targetImage(request: BundleTargetRequest, plant?: Plant): Promise<TargetImage> {
  const files = buildBundleSources({
    retrofit: { name: "Emulator wrapper proof" },
    revision: 1,
    // demo data: the stage does not enter the images, only the target requests do
    stage: { kind: "timer555-astable", supplyV: 12, ra: 10e3, rb: 10e3, c: 1e-6 },
    targets: [request],
  });
  const folder = request.device;
  const plan = (
    JSON.parse(String(files.find((f) => f.path === "plan.json")!.content)) as {
      targets: { plan: BundlePlan }[];
    }
  ).targets[0].plan;
  let sources = files.filter((f) => f.path.startsWith(`${folder}/`));
  if (plant) {
    const path = `${folder}/${plant.file}`;
    sources = sources.map((f) => {
      if (f.path !== path) return f;
      const next = String(f.content).replace(plant.from, plant.to);
      if (next === f.content) throw new Error(`planted fault: ${String(plant.from)} not in ${path}`);
      return { path, content: next };
    });
  }
  const images = await buildTargetImages(sources, folder, request.device);
  // Half a timer count either side: firmware.md build contract ("timing of an image matches its plan within
  // half a timer count"); callers add the emulator's own step where it has one.
  const halfCount = plan.divider / plan.clockHz / 2;
  return {
    plan,
    input: {
      device: request.device,
      folder,
      files: [...sources, ...images],
      planned: { periodS: request.periodS, highS: request.highS, pin: plan.pin.port },
      kind: "periodic",
      toleranceS: { period: halfCount, high: halfCount },
    },
  };
}
