// Roles and what each may do (product.md "People and roles"). The server checks
// these in every handler and action; the UI only uses them to hide buttons.
import type { Role } from "@/db/schema";

export const ROLES = ["admin", "engineer", "reviewer", "technician"] as const satisfies readonly Role[];

export const ROLE_LABELS: Record<Role, string> = {
  admin: "Admin",
  engineer: "Engineer",
  reviewer: "Reviewer",
  technician: "Technician",
};

/** Roles that may read drafts and everything else of every retrofit. */
export const READ_ALL: Role[] = ["admin", "engineer", "reviewer"];
/** Roles that may create and edit retrofits and generate revisions. */
export const EDIT: Role[] = ["admin", "engineer"];
/** Roles that may comment and decide on revisions. */
export const REVIEW: Role[] = ["admin", "reviewer"];
/** Roles that may upload captures. */
export const CAPTURE: Role[] = ["admin", "engineer", "technician"];
/** Roles that may record field checks. */
export const FIELD: Role[] = ["admin", "technician"];
export const ADMIN: Role[] = ["admin"];
export const ANY: Role[] = [...ROLES];
/** Roles that may open the field pages (approved bundles, captures, checks). */
export const FIELD_VIEW: Role[] = ["admin", "engineer", "technician"];
/** Roles that may open the review queue. */
export const REVIEW_VIEW: Role[] = ["admin", "engineer", "reviewer"];
