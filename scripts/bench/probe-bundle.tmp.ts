import { analyzeStage, planTarget } from "@/lib/engine";
import { buildBundleFiles, zipBundle } from "@/lib/bundle";
import { sixDeviceSpec, STAGE } from "./workload";
import { median, timeRuns } from "./stats";
const a = analyzeStage(STAGE);
const spec = sixDeviceSpec(a.periodS, a.highS);
console.log("period", a.periodS, a.highS);
for (const t of spec.targets)
  console.log(
    t.device,
    median(await timeRuns(() => planTarget(t), 15, 3)).toFixed(2),
    "ms",
    planTarget(t).mode,
    planTarget(t).timer,
  );
console.log("analyze", median(await timeRuns(() => analyzeStage(STAGE), 15, 3)).toFixed(2));
console.log("files", median(await timeRuns(() => buildBundleFiles(spec), 15, 3)).toFixed(2));
const files = buildBundleFiles(spec);
console.log("zip", median(await timeRuns(() => zipBundle(files), 15, 3)).toFixed(2));
