// Cautions printed in the README and every checklist when the retrofit is
// marked mains-powered or drives a thyristor (product requirement).
import type { BundleRetrofit } from "./types";

export function needsCautions(retrofit: BundleRetrofit): boolean {
  return retrofit.mainsPowered === true || retrofit.drivesThyristor === true;
}

export function cautionLines(retrofit: BundleRetrofit): string[] {
  if (!needsCautions(retrofit)) return [];
  const lines: string[] = [];
  if (retrofit.mainsPowered) {
    lines.push(
      "The board is mains-powered. Isolate the supply and lock it out (with your own lock and tag) before any work on it.",
      "Verify the absence of voltage with a tested voltage detector on every conductor you will touch; test the detector again afterwards.",
      "Bench measurements on a live board: use an isolated or battery-powered instrument, or differential probes; never float a scope ground.",
    );
  }
  if (retrofit.drivesThyristor) {
    lines.push(
      "The output fires a thyristor gate. Where the old stage drove it through a pulse transformer, keep galvanic isolation: drive the gate through a pulse transformer or an opto-isolated gate driver, never straight from a microcontroller pin.",
      "Check the gate drive (current, pulse width, polarity) against the thyristor's datasheet before connecting the load circuit.",
    );
  }
  lines.push(
    "Local electrical codes and licensed practice prevail over this checklist; work on mains circuits only if you are qualified and authorised to.",
  );
  return lines;
}
