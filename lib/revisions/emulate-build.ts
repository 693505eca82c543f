// The build's emulation step: every target's built image runs in its device
// emulator (lib/firmware/emulate) one after the other (the workers' machines
// are small), with an "emulating" progress report per target. The result per
// folder is stored by buildRevision in the same transaction as the files.
// Server-only (runs the emulators).
import { sha256Hex, type BundleFile, type BundleSpec } from "@/lib/bundle";
import { targetFolders } from "@/lib/bundle/folders";
import { planTarget, type TimerPlan } from "@/lib/engine";
import { emulateTarget, runImageOf } from "@/lib/firmware/emulate";
import { emulationInputOf } from "@/lib/firmware/emulate/plan-input";
import type { RevisionEmulations } from "./emulations";

/** The image the device's emulator runs: what the approval's image sha256 names. */
function imageOf(files: BundleFile[], folder: string, device: string) {
  const inner = runImageOf(device);
  const f = inner ? files.find((x) => x.path === `${folder}/${inner}`) : undefined;
  return f ? { path: f.path, sha256: sha256Hex(f.content) } : null;
}

export async function emulateBuilt(
  spec: BundleSpec,
  files: BundleFile[],
  onTarget: (folder: string) => Promise<void> | void,
): Promise<RevisionEmulations> {
  const folders = targetFolders(spec.targets.map((t) => t.device));
  const out: RevisionEmulations = {};
  for (const [index, request] of spec.targets.entries()) {
    const folder = folders[index];
    await onTarget(folder);
    const plan = planTarget(request) as TimerPlan;
    const input = emulationInputOf(plan, folder, files);
    const result = await emulateTarget(input);
    out[folder] = {
      ...result,
      index,
      device: request.device,
      planned: input.planned,
      toleranceS: input.toleranceS,
      image: imageOf(files, folder, request.device),
    };
  }
  return out;
}
