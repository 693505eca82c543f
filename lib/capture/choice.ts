// The measurement choices a user makes for a capture: which voltage column
// (channel, 1-based as on the scope) and the probe attenuation the scope did
// not apply. Shared by the upload, the re-measure route and the forms.
import type { CaptureMeasurement, CaptureOptions } from "./types";

/** Probe factors offered (the common passive probe ratios). */
export const PROBE_CHOICES = [1, 10, 100] as const;
/** More channels than any bench scope export we read. */
export const MAX_CHANNEL = 16;

export type CaptureChoice = { channel: number; probe: number };

/** The choice as parser options. */
export function choiceOptions(choice: CaptureChoice): CaptureOptions {
  return { voltageColumn: choice.channel - 1, probeAttenuation: choice.probe };
}

/** The choice a stored measurement was made with (channel 1, probe 1 when older). */
export function choiceOf(m: Pick<CaptureMeasurement, "scaling">): CaptureChoice {
  return { channel: (m.scaling?.voltageColumn ?? 0) + 1, probe: m.scaling?.probe ?? 1 };
}

/** Reads "channel" and "probe" (strings from a query or numbers from JSON);
 *  returns the choice or the problems keyed by field. */
export function readChoice(raw: {
  channel?: unknown;
  probe?: unknown;
}): { ok: true; choice: CaptureChoice } | { ok: false; fields: Record<string, string> } {
  const fields: Record<string, string> = {};
  const num = (x: unknown) =>
    typeof x === "number" ? x : typeof x === "string" && /^\d+$/.test(x.trim()) ? Number(x) : NaN;
  const channel =
    raw.channel === undefined || raw.channel === null || raw.channel === "" ? 1 : num(raw.channel);
  const probe = raw.probe === undefined || raw.probe === null || raw.probe === "" ? 1 : num(raw.probe);
  if (!Number.isInteger(channel) || channel < 1 || channel > MAX_CHANNEL)
    fields.channel = `Channel is a whole number from 1 to ${MAX_CHANNEL}.`;
  if (!(PROBE_CHOICES as readonly number[]).includes(probe))
    fields.probe = `Probe attenuation is one of ${PROBE_CHOICES.map((p) => `${p}x`).join(", ")}.`;
  return Object.keys(fields).length > 0 ? { ok: false, fields } : { ok: true, choice: { channel, probe } };
}
