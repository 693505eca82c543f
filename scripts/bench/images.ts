// Image part: time to build each target's ready-to-flash images with its own
// Makefile, and a whole six-device bundle with images (buildBundleFiles).
// A device whose Makefile does not build yet is reported, not hidden.
import { analyzeStage } from "@/lib/engine";
import { buildBundleFiles, buildBundleSources } from "@/lib/bundle";
import { targetFolders } from "@/lib/bundle/folders";
import { buildTargetImages } from "@/lib/firmware/build-images";
import { figure, type Figure } from "./figures";
import { sixDeviceSpec, STAGE } from "./workload";

export async function imagesPart(log: (s: string) => void) {
  const a = analyzeStage(STAGE);
  const spec = sixDeviceSpec(a.periodS, a.highS);
  const sources = buildBundleSources(spec);
  const folders = targetFolders(spec.targets.map((t) => t.device));
  const figures: Figure[] = [];
  const details: Record<string, number | string> = {};
  for (const [i, t] of spec.targets.entries()) {
    const t0 = performance.now();
    try {
      await buildTargetImages(sources, folders[i], t.device);
      const ms = performance.now() - t0;
      details[t.device] = ms;
      figures.push(figure(`images: ${t.device} build`, ms, "ms", undefined, "one make -C run, cold"));
    } catch (e) {
      details[t.device] = String((e as Error).message);
      figures.push(
        figure(`images: ${t.device} build`, NaN, "ms", undefined, `not built: ${(e as Error).message}`),
      );
    }
  }
  const t0 = performance.now();
  try {
    await buildBundleFiles(spec);
    const ms = performance.now() - t0;
    figures.push(
      figure(
        "images: six-device bundle with images",
        ms,
        "ms",
        undefined,
        "buildBundleFiles, 2 builds at a time",
      ),
    );
  } catch (e) {
    figures.push(
      figure(
        "images: six-device bundle with images",
        NaN,
        "ms",
        undefined,
        `not built: ${(e as Error).message}`,
      ),
    );
  }
  log(`images: ${JSON.stringify(details)}`);
  return { figures, details };
}
