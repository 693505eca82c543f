// The delay after the zero crossing for a wanted load power fraction or
// firing angle (engine.md section 6: the RMS formula read the other way,
// lib/engine/stages/sync.ts). Used by the target form; every refusal names
// its field and changes nothing.
import { angleForPowerFraction, delayForAngle, loadRmsFraction } from "@/lib/engine";
import { readEng } from "./eng";

export type DelayFrom = "power" | "angle";

export type FiringDelay =
  | { ok: true; delayS: number; angleDeg: number; powerFraction: number }
  | { ok: false; field: "mainsHz" | "power" | "angle"; message: string };

export function firingDelayFrom(from: DelayFrom, value: string, mainsHzText: unknown): FiringDelay {
  const hz = readEng(mainsHzText, "Hz");
  if (!hz.ok || !(hz.value > 0))
    return {
      ok: false,
      field: "mainsHz",
      message: "Mains frequency is needed: fill the stage's mains frequency (Synchronised to the mains).",
    };
  const v = Number(
    String(value)
      .trim()
      .replace(/\s*(%|°|deg)$/, ""),
  );
  if (from === "power") {
    if (!Number.isFinite(v) || v <= 0 || v > 100)
      return {
        ok: false,
        field: "power",
        message: "Power fraction is a percentage above 0 and at most 100.",
      };
    const angleDeg = angleForPowerFraction(v / 100);
    return { ok: true, delayS: delayForAngle(angleDeg, hz.value), angleDeg, powerFraction: v / 100 };
  }
  if (!Number.isFinite(v) || v < 0 || v >= 180)
    return {
      ok: false,
      field: "angle",
      message: "Firing angle is in degrees, from 0 up to (not including) 180.",
    };
  const a = (v * Math.PI) / 180;
  return {
    ok: true,
    delayS: delayForAngle(v, hz.value),
    angleDeg: v,
    powerFraction: loadRmsFraction(a) ** 2,
  };
}
