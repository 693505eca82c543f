// The full bundle: sources, then every target's ready-to-flash images built
// with the bundle's own Makefile (buildTargetImages), then README and
// checklists that list the images' sha256 and the toolchain versions.
// Server-only: runs the Debian toolchains (firmware.md, build contract).
import { createHash } from "node:crypto";
import { planTarget } from "@/lib/engine";
import { buildBundleSourcesWith, type BundleImages, type Planner } from "@/lib/bundle/build";
import { targetFolders } from "@/lib/bundle/folders";
import type { BundleFile, BundleSpec } from "@/lib/bundle/types";
import { buildTargetImages } from "./build-images";
import { toolchainVersions } from "./toolchains";

export interface ImageBuildOptions {
  /** Images built earlier for the same sources (generation builds them before taking the row lock). */
  prebuilt?: PrebuiltImages;
  /** How many targets build at once (default 2: the machines this runs on are small). */
  parallel?: number;
  /** Told when a target's compile starts and ends (the revision page shows it live). */
  onTarget?: (folder: string, step: "compiling" | "compiled") => Promise<void> | void;
}

/** Images keyed by the sha256 of the sources they were built from. */
export type PrebuiltImages = Map<string, BundleFile[]>;

const planner: Planner = (request) => planTarget(request);

/**
 * The images never depend on the revision number (it is in comments and
 * documents only), so they are built from the sources rendered for revision 0:
 * one build serves a prebuild outside the lock and the stored revision.
 */
function imageInputs(
  spec: BundleSpec,
): { folder: string; device: string; key: string; files: BundleFile[] }[] {
  const sources = buildBundleSourcesWith({ ...spec, revision: 0 }, planner);
  const folders = targetFolders(spec.targets.map((t) => t.device));
  return spec.targets.map((t, i) => {
    const folder = folders[i];
    const files = sources.filter((f) => f.path.startsWith(`${folder}/`));
    const h = createHash("sha256");
    for (const f of files) h.update(`${f.path}\0`).update(f.content).update("\0");
    return { folder, device: t.device, key: h.digest("hex"), files };
  });
}

async function pool<T, R>(items: T[], limit: number, fn: (item: T) => Promise<R>): Promise<R[]> {
  const out: R[] = new Array(items.length);
  let next = 0;
  async function worker() {
    while (next < items.length) {
      const i = next++;
      out[i] = await fn(items[i]);
    }
  }
  await Promise.all(Array.from({ length: Math.max(1, Math.min(limit, items.length)) }, worker));
  return out;
}

/** Builds (or reuses) every target's images. Throws FirmwareBuildError for the first target that fails. */
export async function buildBundleImages(
  spec: BundleSpec,
  opts: ImageBuildOptions = {},
): Promise<BundleImages> {
  const inputs = imageInputs(spec);
  const built = await pool(inputs, opts.parallel ?? 2, async (t) => {
    const reuse = opts.prebuilt?.get(t.key);
    if (reuse) return reuse;
    await opts.onTarget?.(t.folder, "compiling");
    const images = await buildTargetImages(t.files, t.folder, t.device);
    opts.prebuilt?.set(t.key, images);
    await opts.onTarget?.(t.folder, "compiled");
    return images;
  });
  const byFolder: Record<string, BundleFile[]> = {};
  inputs.forEach((t, i) => (byFolder[t.folder] = built[i]));
  return { byFolder, toolchains: await toolchainVersions(spec.targets.map((t) => t.device)) };
}

/** The bundle as stored and zipped: sources, documents, plan.json and the images. */
export async function buildBundleFiles(
  spec: BundleSpec,
  opts: ImageBuildOptions = {},
): Promise<BundleFile[]> {
  // Planning errors surface here, before any compiler runs.
  buildBundleSourcesWith(spec, planner);
  const images = await buildBundleImages(spec, opts);
  return buildBundleSourcesWith(spec, planner, images);
}
