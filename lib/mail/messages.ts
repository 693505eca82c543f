// Texts of the review and account messages. Plain text, terse, with the link
// that takes the reader straight to the page where they act.
import type { OutgoingMail } from "./outbox";
import { env } from "@/lib/env";

type RevisionInfo = { id: number; number: number };
type RetrofitInfo = { id: number; name: string; site: string; assetTag: string };
type Person = { name: string; email: string };

const base = () => env().NEXTAUTH_URL.replace(/\/$/, "");
const label = (rf: RetrofitInfo, rev: RevisionInfo) => `${rf.name} (${rf.assetTag}) r${rev.number}`;

export function reviewRequestedMail(o: {
  revision: RevisionInfo;
  retrofit: RetrofitInfo;
  author: Person;
  reviewers: Person[];
  note: string;
}): OutgoingMail[] {
  const subject = `Review requested: ${label(o.retrofit, o.revision)}`;
  const body = [
    `${o.author.name} submitted ${label(o.retrofit, o.revision)} at ${o.retrofit.site} for review.`,
    o.note ? `\nNote: ${o.note}\n` : "",
    `Compare and decide: ${base()}/retrofits/${o.retrofit.id}/compare?b=${o.revision.id}`,
    `Review page: ${base()}/revisions/${o.revision.id}/review`,
  ].join("\n");
  return o.reviewers.map((r) => ({ kind: "review-requested", to: r.email, subject, body }));
}

export function decisionMail(o: {
  revision: RevisionInfo;
  retrofit: RetrofitInfo;
  author: Person;
  reviewer: Person;
  decision: "approved" | "changes_requested";
  note: string;
}): OutgoingMail {
  const verdict = o.decision === "approved" ? "approved" : "changes requested";
  const next =
    o.decision === "approved"
      ? "The bundle is now available to the field technicians."
      : "Address the comments, generate a new revision and submit it.";
  return {
    kind: "review-decision",
    to: o.author.email,
    subject: `Review decision (${verdict}): ${label(o.retrofit, o.revision)}`,
    body: [
      `${o.reviewer.name} decided on ${label(o.retrofit, o.revision)}: ${verdict}.`,
      o.note ? `\nNote: ${o.note}\n` : "",
      next,
      `Review page: ${base()}/revisions/${o.revision.id}/review`,
    ].join("\n"),
  };
}

export function approvedMail(o: {
  revision: RevisionInfo & { bundleSha256: string };
  retrofit: RetrofitInfo;
  technicians: Person[];
}): OutgoingMail[] {
  const subject = `Revision approved: ${label(o.retrofit, o.revision)}`;
  const body = [
    `${label(o.retrofit, o.revision)} at ${o.retrofit.site} is approved for the field and replaces any earlier approved revision.`,
    `Bundle sha256: ${o.revision.bundleSha256}`,
    `Download and checklist: ${base()}/revisions/${o.revision.id}`,
  ].join("\n");
  return o.technicians.map((t) => ({ kind: "revision-approved", to: t.email, subject, body }));
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
