// The release rule for missed budgets: a revision with a target whose
// accuracy budget (lib/engine/budget.ts, including the gate-drive verdict)
// says "misses" is released only with a recorded override and its reason.
// Pure: reads the stored plans of the revision.
import { DEVICES } from "@/lib/bundle/devices";

export type MissedTarget = { position: number; device: string; findings: string[] };

const obj = (v: unknown): Record<string, unknown> =>
  v !== null && typeof v === "object" && !Array.isArray(v) ? (v as Record<string, unknown>) : {};

/** Every target whose stored budget verdict is "misses", with the budget's own findings. */
export function missedTargets(plans: unknown): MissedTarget[] {
  const out: MissedTarget[] = [];
  (Array.isArray(plans) ? plans : []).forEach((entry, i) => {
    const e = obj(entry);
    const budget = obj(e.budget);
    if (budget.verdict !== "misses") return;
    const device = String(obj(e.plan).device ?? "");
    const gate = obj(budget.gate);
    const findings = [
      ...(Array.isArray(budget.notes) ? budget.notes : []),
      ...(Array.isArray(gate.findings) ? gate.findings : []),
    ]
      .filter((x): x is string => typeof x === "string")
      .filter((x, k, all) => all.indexOf(x) === k);
    out.push({ position: i + 1, device: DEVICES[device]?.name ?? device, findings });
  });
  return out;
}

/** One line per missed target for mails, pages and the refusal. */
export function missedText(missed: MissedTarget[]): string {
  return missed
    .map(
      (m) =>
        `target ${m.position} (${m.device}) misses its budget${m.findings.length ? `: ${m.findings.join(" ")}` : ""}`,
    )
    .join("; ");
}

export type Override = { reason: string; text: string; targets: MissedTarget[] };

/**
 * The release rule itself: with no missed target a release needs nothing
 * (override null); with one, a reason that is more than blanks, which is kept
 * trimmed with the missed targets. `refusal` is the message when it is missing.
 */
export function releaseOverride(
  plans: unknown,
  overrideReason: string,
  revisionNumber: number,
): { override: Override | null } | { refusal: string } {
  const missed = missedTargets(plans);
  if (missed.length === 0) return { override: null };
  const reason = overrideReason.trim();
  if (!reason)
    return {
      refusal: `r${revisionNumber} cannot be released as it is: ${missedText(missed)}. Return it, or release it with an override and the reason.`,
    };
  return { override: { reason, text: missedText(missed), targets: missed } };
}
