// Bundle contract (engine.md section 5): spec -> sorted files -> zip.
export { buildBundleSources, buildBundleSourcesWith } from "./build";
export type { Planner, BundleImages } from "./build";
// The full bundle with images runs the toolchains (server-only).
export { buildBundleFiles, buildBundleImages } from "@/lib/firmware/bundle";
export type { ImageBuildOptions, PrebuiltImages } from "@/lib/firmware/bundle";
export { FirmwareBuildError } from "@/lib/firmware/build-images";
export { zipBundle } from "./zip";
export { sha256Hex } from "./hash";
export { textOf, isTextFile } from "./text";
export { checklistLimits, withinLimit, limitBasis, DEFAULT_CLOCK_ACCURACY_PPM } from "./limits";
export type { ChecklistLimit, ChecklistBasis, LimitId } from "./limits";
export { cautionLines, needsCautions } from "./safety";
export { stableJson, sortKeysDeep } from "./plan-json";
export type {
  BundleFile,
  BundlePlan,
  BundleSpec,
  BundleRetrofit,
  BundleTargetRequest,
  BundlePin,
} from "./types";
