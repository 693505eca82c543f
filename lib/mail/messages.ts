// Texts of the review and account messages. Plain text, terse, with the link
// that takes the reader straight to the page where they act.
import type { OutgoingMail } from "./outbox";
import { env } from "@/lib/env";
import { DECISION_WORDS, type DecisionWord } from "@/lib/review/words";

type RevisionInfo = { id: number; number: number };
type RetrofitInfo = { id: number; name: string; site: string; assetTag: string };
type Person = { name: string; email: string };
/** A release despite a missed budget: the checker's reason and what misses. */
type Override = { reason: string; missed: string } | null | undefined;

const overrideLines = (o: Override) =>
  o ? `\nReleased despite a missed budget: ${o.missed}.\nReason given by the checker: ${o.reason}\n` : "";

const base = () => env().NEXTAUTH_URL.replace(/\/$/, "");
const label = (rf: RetrofitInfo, rev: RevisionInfo) => `${rf.name} (${rf.assetTag}) r${rev.number}`;

export function reviewRequestedMail(o: {
  revision: RevisionInfo;
  retrofit: RetrofitInfo;
  author: Person;
  reviewers: Person[];
  note: string;
  /** Set when a target was not proven in the emulator: the author's reason (proof-gate.ts). */
  unprovenReason?: string | null;
}): OutgoingMail[] {
  const subject = `Please check: ${label(o.retrofit, o.revision)}`;
  const body = [
    `${o.author.name} sent ${label(o.retrofit, o.revision)} at ${o.retrofit.site} for checking.`,
    o.note ? `\nNote: ${o.note}\n` : "",
    o.unprovenReason
      ? `\nNot every target was proven in the emulator. The author's reason: ${o.unprovenReason}\n`
      : "",
    `Compare with the earlier revision: ${base()}/retrofits/${o.retrofit.id}/compare?b=${o.revision.id}`,
    `Release or return it here: ${base()}/revisions/${o.revision.id}/review`,
  ].join("\n");
  return o.reviewers.map((r) => ({ kind: "review-requested", to: r.email, subject, body }));
}

export function decisionMail(o: {
  revision: RevisionInfo;
  retrofit: RetrofitInfo;
  author: Person;
  reviewer: Person;
  decision: DecisionWord;
  note: string;
  override?: Override;
}): OutgoingMail {
  const verdict = DECISION_WORDS[o.decision];
  const next =
    o.decision === "release"
      ? "The bundle is now the field revision; technicians at the site can download and flash it."
      : "Work through the comments, generate a new revision and send it for checking.";
  return {
    kind: "review-decision",
    to: o.author.email,
    subject: `${o.decision === "release" ? "Released" : "Returned"}: ${label(o.retrofit, o.revision)}`,
    body: [
      `${o.reviewer.name} checked ${label(o.retrofit, o.revision)}: ${verdict}.`,
      o.note ? `\nNote: ${o.note}\n` : "",
      overrideLines(o.override),
      next,
      `Check page: ${base()}/revisions/${o.revision.id}/review`,
    ].join("\n"),
  };
}

/** To the site's technicians: which revision is now current, exactly, and
 *  which earlier released revisions it replaces (none, or their numbers). */
export function releasedMail(o: {
  revision: RevisionInfo & { bundleSha256: string };
  retrofit: RetrofitInfo;
  technicians: Person[];
  replaces: number[];
  note: string;
  override?: Override;
}): OutgoingMail[] {
  const subject = `Field revision now r${o.revision.number}: ${o.retrofit.name} (${o.retrofit.assetTag})`;
  const replaced =
    o.replaces.length === 0
      ? "No earlier revision of this retrofit was released for the field."
      : `It replaces ${o.replaces.map((n) => `r${n}`).join(", ")}; do not flash ${o.replaces.length === 1 ? "that revision" : "those revisions"} any more.`;
  const body = [
    `${label(o.retrofit, o.revision)} at ${o.retrofit.site} is released for the field and is now the current field revision.`,
    replaced,
    o.note ? `\nNote from the checker: ${o.note}\n` : "",
    overrideLines(o.override),
    `Bundle sha256: ${o.revision.bundleSha256}`,
    `Download and checklist: ${base()}/field/revisions/${o.revision.id}`,
  ].join("\n");
  return o.technicians.map((t) => ({ kind: "revision-released", to: t.email, subject, body }));
}

export function invitationMail(o: {
  to: Person;
  role: string;
  invitedBy: Person;
  token: string;
  expiresAt: Date;
}): OutgoingMail {
  return {
    kind: "invitation",
    to: o.to.email,
    subject: "Your Clockgraft account",
    body: [
      `${o.invitedBy.name} made a Clockgraft account for you (role: ${o.role}).`,
      `Set your password here (the link works once, until ${o.expiresAt.toISOString().slice(0, 16).replace("T", " ")} UTC):`,
      `${base()}/invite/${o.token}`,
      "",
      "If you did not expect this, ignore the message; the link expires on its own.",
    ].join("\n"),
  };
}
