// Who may read which revision (product.md "People and roles"): admins,
// engineers and reviewers read every revision; technicians read approved
// revisions only, and only of their own site when their account names one.
// Pure functions, so pages, route handlers and server actions share one rule.
import type { Role } from "@/db/schema";
import { ApiError } from "@/lib/api/errors";
import { READ_ALL } from "@/lib/auth/roles";

export type RevisionReader = { role: Role; site: string | null };
export type ReadableRevision = { state: string };
export type ReadableRetrofit = { site: string };

export function canReadRevision(
  user: RevisionReader,
  revision: ReadableRevision,
  retrofit: ReadableRetrofit,
): boolean {
  if (READ_ALL.includes(user.role)) return true;
  if (user.role !== "technician") return false;
  if (revision.state !== "released") return false;
  return user.site === null || user.site === retrofit.site;
}

/** Throws 404 when a technician asks for a revision they may not see, so the
 *  answer does not reveal that a draft or another site's revision exists;
 *  403 for any other role outside the rule. */
export function assertCanReadRevision(
  user: RevisionReader,
  revision: ReadableRevision,
  retrofit: ReadableRetrofit,
): void {
  if (canReadRevision(user, revision, retrofit)) return;
  if (user.role === "technician") throw new ApiError("not_found", "Revision was not found.");
  throw new ApiError("forbidden", `The ${user.role} role may not read this revision.`);
}

/** Technicians may see a retrofit only through an approved revision of their site. */
export function canReadRetrofitDetails(user: RevisionReader): boolean {
  return READ_ALL.includes(user.role);
}
