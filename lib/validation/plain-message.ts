// One place that turns an engine message into the words the user sees: field
// names become the labels on the form ("peakV" -> "Peak (trip) voltage",
// "tolerances.rb" -> "tolerance of R B") and bare numbers with a unit are
// printed in engineering notation ("0.00001671 s" -> "16.71 µs", "5e-7 s" ->
// "500 ns"). The API keeps the field path separately, so nothing is lost.
import { formatEng, STAGE_FIELDS, type EngUnit } from "@/lib/engine";

/** Request and plan fields the engine names, in the form's words. */
const PLAN_WORDS: Record<string, string> = {
  periodS: "period",
  highS: "high time",
  clockHz: "clock frequency",
  clockSource: "clock source",
  clockAccuracyPpm: "clock accuracy",
  delayS: "delay",
  pulseS: "pulse width",
  minIntervalS: "shortest time between input edges",
  activeLow: "output polarity",
};

const UNITS: Record<string, EngUnit> = { s: "s", Hz: "Hz", V: "V", Ω: "Ω", ohm: "Ω", F: "F", A: "A" };

function labelsOf(kind?: string): Map<string, string> {
  const fields = (STAGE_FIELDS as Record<string, readonly { name: string; label: string }[]>)[kind ?? ""];
  const out = new Map<string, string>(Object.entries(PLAN_WORDS));
  // Every kind's labels, so a message about another kind's field still reads.
  for (const list of Object.values(
    STAGE_FIELDS as Record<string, readonly { name: string; label: string }[]>,
  ))
    for (const f of list) if (!out.has(f.name)) out.set(f.name, f.label);
  for (const f of fields ?? []) out.set(f.name, f.label);
  return out;
}

/** An engine message in the user's words; `kind` picks the stage's own labels first. */
export function plainMessage(message: string, kind?: string): string {
  const labels = labelsOf(kind);
  let text = message.replace(/\b(?:stage\.)?tolerances\.([A-Za-z]\w*)/g, (m, name: string) =>
    labels.has(name) ? `tolerance of ${labels.get(name)}` : m,
  );
  text = text.replace(
    /\b(?:stage\.)?([a-z][A-Za-z0-9]*[A-Z][A-Za-z0-9]*)\b/g,
    (m, name: string) => labels.get(name) ?? m,
  );
  // Bare numbers with a unit, not already carrying an SI prefix.
  text = text.replace(
    /(^|[\s(=:])([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?) ?(s|Hz|V|Ω|ohm|F|A)\b/g,
    (m, lead: string, num: string, unit: string) => {
      const v = Number(num);
      if (!Number.isFinite(v)) return m;
      return `${lead}${formatEng(v, UNITS[unit], 4)}`;
    },
  );
  return text;
}
