// ONE table of every route handler and page, with the roles the product
// allows (product.md "People and roles", lib/auth/roles.ts) and a builder for
// a valid request. The matrix test runs every principal against every entry;
// the completeness test fails when app/ has a handler or page not listed here.
import type { Role } from "@/db/schema";
import { FIELD_CHECK_MAX_BYTES } from "@/lib/field/record-check";
import { makeToken } from "../../helpers/users";
import {
  makeCapture,
  makeComment,
  makeRetrofit,
  makeRevision,
  squareCsv,
  type Principal,
  type World,
} from "./world";

export type Method = "GET" | "POST" | "PATCH" | "PUT" | "DELETE";

export type BuiltRequest = {
  path: string;
  /** JSON body (sent as application/json). */
  json?: unknown;
  /** Raw body with its content type (capture upload). */
  raw?: { body: string; type: string };
};

export type RouteEntry = {
  method: Method;
  /** The folder path under app/, as Next.js names it: /api/v1/retrofits/[id]. */
  pattern: string;
  /** Roles that succeed; "public" = anyone, signed in or not. */
  allowed: readonly Role[] | "public";
  /** Refused roles that get 404 instead of 403, because the object is hidden
   *  from them (a technician asking for a draft or another site's object). */
  hiddenFrom?: readonly Role[];
  /** Success statuses (default 200). */
  ok?: readonly number[];
  /** Builds a valid request for this principal; may create fresh objects so
   *  that every allowed case acts on an object in the right state. */
  build: (w: World, as: Principal) => Promise<BuiltRequest>;
  /** The request carries input the bad-input corpus should mutate. */
  input?: "json" | "csv" | "query";
  /** The route's own body limit where it is above the default 1 MiB (the oversize case goes past it). */
  maxBodyBytes?: number;
};

const READ_ALL: Role[] = ["admin", "engineer", "reviewer"];
const EDIT: Role[] = ["admin", "engineer"];
const REVIEW: Role[] = ["admin", "reviewer"];
const ANY: Role[] = ["admin", "engineer", "reviewer", "technician"];
const CAPTURE: Role[] = ["admin", "engineer", "technician"];
const FIELD: Role[] = ["admin", "technician"];
const ADMIN: Role[] = ["admin"];

/** The acting user's id, or the spare engineer's for signed-out principals. */
export function actingId(w: World, as: Principal): number {
  return as === "signed-out" || as === "revoked-token" ? w.author.id : w.actors[as].id;
}

const planBody = () => ({
  stage: { kind: "measured", periodS: "10m", highS: "2m" },
  targets: [
    { device: "atmega328p", clockSource: "crystal", clockHz: "16M", mode: "pwm", requiredTolerancePct: 2 },
  ],
});

const fresh = async (w: World) => makeRetrofit(w, w.author.id);

export const ROUTES: RouteEntry[] = [
  // Unknown API paths answer our JSON 404 for everyone (issue 15 point 8).
  {
    method: "GET",
    pattern: "/api/v1/[...rest]",
    allowed: "public",
    ok: [404],
    build: async () => ({ path: "/api/v1/no-such-thing/7" }),
  },
  {
    method: "POST",
    pattern: "/api/v1/[...rest]",
    allowed: "public",
    ok: [404],
    build: async () => ({ path: "/api/v1/retrofits/1/no-such-thing", json: {} }),
  },
  ...(["PUT", "PATCH", "DELETE"] as const).map((method): RouteEntry => ({
    method,
    pattern: "/api/v1/[...rest]",
    allowed: "public",
    ok: [404],
    build: async () => ({ path: "/api/v1/users/1/no-such-thing" }),
  })),
  { method: "GET", pattern: "/api/health", allowed: "public", build: async () => ({ path: "/api/health" }) },
  {
    method: "GET",
    pattern: "/api/auth/[...nextauth]",
    allowed: "public",
    build: async () => ({ path: "/api/auth/providers" }),
  },
  {
    // next-auth's own client log endpoint: public by design, stores nothing.
    method: "POST",
    pattern: "/api/auth/[...nextauth]",
    allowed: "public",
    build: async () => ({ path: "/api/auth/_log", json: { level: "debug", code: "probe", message: "x" } }),
  },
  {
    method: "POST",
    pattern: "/api/v1/plan",
    allowed: ANY,
    input: "json",
    build: async () => ({ path: "/api/v1/plan", json: planBody() }),
  },
  {
    method: "GET",
    pattern: "/api/v1/retrofits",
    allowed: READ_ALL,
    input: "query",
    build: async () => ({ path: "/api/v1/retrofits?q=Reliability&page=1&pageSize=5&sort=name&dir=asc" }),
  },
  {
    method: "POST",
    pattern: "/api/v1/retrofits",
    allowed: EDIT,
    ok: [201],
    input: "json",
    build: async (w) => ({
      path: "/api/v1/retrofits",
      json: {
        name: `Reliability ${w.tag} new`,
        site: w.site,
        assetTag: `RL-NEW-${w.tag}`,
        ...planBody(),
      },
    }),
  },
  {
    method: "GET",
    pattern: "/api/v1/retrofits/[id]",
    allowed: READ_ALL,
    build: async (w) => ({ path: `/api/v1/retrofits/${w.retrofitId}` }),
  },
  {
    method: "PATCH",
    pattern: "/api/v1/retrofits/[id]",
    allowed: EDIT,
    input: "json",
    build: async (w) => ({
      path: `/api/v1/retrofits/${(await fresh(w)).id}`,
      json: { description: "Relay cabinet 3", ...planBody() },
    }),
  },
  {
    method: "DELETE",
    pattern: "/api/v1/retrofits/[id]",
    allowed: EDIT,
    build: async (w) => ({ path: `/api/v1/retrofits/${(await fresh(w)).id}` }),
  },
  {
    method: "GET",
    pattern: "/api/v1/retrofits/[id]/revisions",
    allowed: READ_ALL,
    build: async (w) => ({ path: `/api/v1/retrofits/${w.retrofitId}/revisions` }),
  },
  {
    method: "POST",
    pattern: "/api/v1/retrofits/[id]/revisions",
    allowed: EDIT,
    // 202: the revision is building; a worker finishes it (`?wait=1` gives 201).
    ok: [202],
    input: "json",
    build: async (w) => ({
      path: `/api/v1/retrofits/${(await fresh(w)).id}/revisions`,
      json: { note: "first" },
    }),
  },
  {
    method: "GET",
    pattern: "/api/v1/retrofits/[id]/field-checks",
    allowed: ANY,
    build: async (w) => ({ path: `/api/v1/retrofits/${w.retrofitId}/field-checks` }),
  },
  {
    method: "GET",
    pattern: "/api/v1/revisions/[id]/build",
    allowed: ANY,
    build: async (w) => ({ path: `/api/v1/revisions/${w.revision.released}/build` }),
  },
  {
    method: "GET",
    pattern: "/api/v1/revisions/[id]",
    allowed: ANY,
    build: async (w) => ({ path: `/api/v1/revisions/${w.revision.released}` }),
  },
  {
    method: "GET",
    pattern: "/api/v1/revisions/[id]/files",
    allowed: ANY,
    build: async (w) => ({ path: `/api/v1/revisions/${w.revision.released}/files` }),
  },
  {
    method: "GET",
    pattern: "/api/v1/revisions/[id]/files/[...path]",
    allowed: ANY,
    build: async (w) => ({ path: `/api/v1/revisions/${w.revision.released}/files/README.md` }),
  },
  {
    method: "GET",
    pattern: "/api/v1/revisions/[id]/bundle",
    allowed: ANY,
    build: async (w) => ({ path: `/api/v1/revisions/${w.revision.released}/bundle` }),
  },
  {
    method: "GET",
    pattern: "/api/v1/revisions/[id]/comments",
    allowed: READ_ALL,
    build: async (w) => ({ path: `/api/v1/revisions/${w.revision.awaiting_check}/comments` }),
  },
  {
    method: "POST",
    pattern: "/api/v1/revisions/[id]/comments",
    allowed: READ_ALL,
    ok: [201],
    input: "json",
    build: async (w) => ({
      path: `/api/v1/revisions/${w.revision.awaiting_check}/comments`,
      json: { body: "Check the prescaler.", filePath: "README.md", line: 1 },
    }),
  },
  {
    method: "PATCH",
    pattern: "/api/v1/comments/[id]",
    allowed: READ_ALL,
    input: "json",
    build: async (w) => {
      const c = await makeComment(w.revision.awaiting_check, w.author.id);
      return { path: `/api/v1/comments/${c.id}`, json: { resolved: true } };
    },
  },
  {
    method: "POST",
    pattern: "/api/v1/revisions/[id]/submit",
    allowed: EDIT,
    input: "json",
    build: async (w, as) => {
      const rf = await fresh(w);
      const rev = await makeRevision(rf.id, actingId(w, as), "prepared");
      return { path: `/api/v1/revisions/${rev.id}/submit`, json: { note: "ready" } };
    },
  },
  {
    method: "POST",
    pattern: "/api/v1/revisions/[id]/decision",
    allowed: REVIEW,
    input: "json",
    build: async (w) => {
      const rf = await fresh(w);
      const rev = await makeRevision(rf.id, w.author.id, "awaiting_check");
      return { path: `/api/v1/revisions/${rev.id}/decision`, json: { decision: "release", note: "ok" } };
    },
  },
  {
    method: "GET",
    pattern: "/api/v1/diff",
    allowed: READ_ALL,
    // Technicians may compare approved revisions only; a draft in the pair is hidden.
    hiddenFrom: ["technician"],
    input: "query",
    build: async (w) => ({ path: `/api/v1/diff?a=${w.revision.released}&b=${w.revision.prepared}` }),
  },
  {
    method: "GET",
    pattern: "/api/v1/tokens",
    allowed: ANY,
    build: async () => ({ path: "/api/v1/tokens" }),
  },
  {
    method: "POST",
    pattern: "/api/v1/tokens",
    allowed: ANY,
    ok: [201],
    input: "json",
    build: async () => ({ path: "/api/v1/tokens", json: { name: "bench laptop" } }),
  },
  {
    method: "DELETE",
    pattern: "/api/v1/tokens/[id]",
    allowed: ANY,
    build: async (w, as) => {
      // A token of the acting user (or the spare engineer's for the signed-out cases).
      await makeToken(actingId(w, as));
      const { db } = await import("@/db/client");
      const { apiTokens } = await import("@/db/schema");
      const { desc, eq } = await import("drizzle-orm");
      const [t] = await db
        .select({ id: apiTokens.id })
        .from(apiTokens)
        .where(eq(apiTokens.userId, actingId(w, as)))
        .orderBy(desc(apiTokens.id))
        .limit(1);
      return { path: `/api/v1/tokens/${t.id}` };
    },
  },
  {
    method: "GET",
    pattern: "/api/v1/audit",
    allowed: ADMIN,
    input: "query",
    build: async (w) => ({
      path: `/api/v1/audit?action=revision.generate&actor=${w.author.id}&from=2020-01-01&page=1`,
    }),
  },
  {
    method: "GET",
    pattern: "/api/v1/invitations",
    allowed: ADMIN,
    build: async () => ({ path: "/api/v1/invitations" }),
  },
  {
    method: "POST",
    pattern: "/api/v1/invitations",
    allowed: ADMIN,
    ok: [201],
    input: "json",
    build: async (w) => ({
      path: "/api/v1/invitations",
      json: {
        email: `invitee-${w.tag}-${Date.now()}@test.invalid`,
        name: "New Tech",
        role: "technician",
        site: w.site,
      },
    }),
  },
  {
    // The one-time token is the credential: anyone holding a fresh link may accept it.
    method: "POST",
    pattern: "/api/v1/invitations/accept",
    allowed: "public",
    input: "json",
    build: async (w) => {
      const { createInvitation } = await import("@/lib/review/invitations");
      const admin = { ...w.actors.admin, name: "Admin", site: null, via: "token" as const };
      const email = `accept-${w.tag}-${Date.now()}-${Math.random().toString(36).slice(2)}@test.invalid`;
      const { token } = await createInvitation(admin, { email, name: "Invitee", role: "technician" });
      return { path: "/api/v1/invitations/accept", json: { token, password: "accept-pass-4k7-long-enough" } };
    },
  },
  {
    method: "PATCH",
    pattern: "/api/v1/users/[id]",
    allowed: ADMIN,
    input: "json",
    build: async (w) => {
      const { makeUser } = await import("../../helpers/users");
      const u = await makeUser("technician");
      w.userIds.push(u.id);
      return { path: `/api/v1/users/${u.id}`, json: { site: "Moved site", role: "engineer" } };
    },
  },
  { method: "GET", pattern: "/api/v1/users", allowed: ADMIN, build: async () => ({ path: "/api/v1/users" }) },
  {
    method: "POST",
    pattern: "/api/v1/captures",
    allowed: CAPTURE,
    ok: [201],
    input: "csv",
    build: async (w) => ({
      path: `/api/v1/captures?retrofitId=${w.retrofitId}`,
      raw: { body: squareCsv(), type: "text/csv" },
    }),
  },
  {
    method: "GET",
    pattern: "/api/v1/captures",
    allowed: ANY,
    build: async (w) => ({ path: `/api/v1/captures?retrofitId=${w.retrofitId}` }),
  },
  {
    method: "GET",
    pattern: "/api/v1/field-checks/[id]/record",
    allowed: ANY,
    build: async (w) => ({ path: `/api/v1/field-checks/${w.fieldCheckId}/record` }),
  },
  {
    method: "GET",
    pattern: "/api/v1/field-checks/photos/[id]",
    allowed: ANY,
    build: async (w) => ({ path: `/api/v1/field-checks/photos/${w.photoId}` }),
  },
  {
    method: "GET",
    pattern: "/api/v1/captures/[id]",
    allowed: ANY,
    build: async (w) => ({ path: `/api/v1/captures/${w.captureId}` }),
  },
  {
    // The uploader (here the technician) or an admin; roles that can read it get 403.
    method: "DELETE",
    pattern: "/api/v1/captures/[id]",
    allowed: FIELD,
    build: async (w) => ({
      path: `/api/v1/captures/${await makeCapture(w.retrofitId, w.actors.technician.id, "to-delete.csv")}`,
    }),
  },
  {
    method: "GET",
    pattern: "/api/v1/captures/[id]/plot",
    allowed: ANY,
    input: "query",
    build: async (w) => ({ path: `/api/v1/captures/${w.captureId}/plot?fromS=0.001&toS=0.05` }),
  },
  {
    method: "POST",
    pattern: "/api/v1/captures/[id]/measurement",
    allowed: CAPTURE,
    input: "json",
    build: async (w, as) => {
      // A technician re-measures an own upload; engineers and admins any capture.
      const capture = await makeCapture(w.retrofitId, actingId(w, as));
      return { path: `/api/v1/captures/${capture}/measurement`, json: { channel: 1, probe: 10 } };
    },
  },
  {
    method: "POST",
    pattern: "/api/v1/captures/[id]/use-as-stage",
    allowed: EDIT,
    input: "json",
    build: async (w) => {
      const rf = await fresh(w);
      const capture = await makeCapture(rf.id, w.actors.technician.id);
      return { path: `/api/v1/captures/${capture}/use-as-stage`, json: { retrofitId: rf.id } };
    },
  },
  {
    method: "POST",
    pattern: "/api/v1/field-checks",
    allowed: FIELD,
    ok: [201],
    input: "json",
    maxBodyBytes: FIELD_CHECK_MAX_BYTES,
    build: async (w) => ({
      path: "/api/v1/field-checks",
      json: {
        revisionId: w.revision.released,
        measuredPeriodS: 10e-3,
        measuredHighS: 2e-3,
        notes: "cabinet 3",
        signedOffBy: "A. Tester",
      },
    }),
  },
  {
    method: "GET",
    pattern: "/api/v1/field-checks",
    allowed: ANY,
    input: "query",
    build: async (w) => ({ path: `/api/v1/field-checks?retrofitId=${w.retrofitId}` }),
  },
];

export type PageEntry = {
  /** The folder path under app/ without route groups: /retrofits/[id]. */
  pattern: string;
  /** Roles that see the page; the rest see the "Not allowed" panel. "public" = anyone. */
  allowed: readonly Role[] | "public";
  path: (w: World) => string;
};

const REVIEW_VIEW: Role[] = ["admin", "engineer", "reviewer"];
const FIELD_VIEW: Role[] = ["admin", "engineer", "technician"];

export const PAGES: PageEntry[] = [
  { pattern: "/", allowed: "public", path: () => "/" },
  { pattern: "/sign-in", allowed: "public", path: () => "/sign-in" },
  { pattern: "/invite/[token]", allowed: "public", path: () => "/invite/not-a-real-token" },
  { pattern: "/admin", allowed: ADMIN, path: () => "/admin" },
  { pattern: "/audit", allowed: ADMIN, path: () => "/audit" },
  { pattern: "/field", allowed: FIELD_VIEW, path: () => "/field" },
  { pattern: "/retrofits", allowed: READ_ALL, path: () => "/retrofits" },
  { pattern: "/retrofits/new", allowed: EDIT, path: () => "/retrofits/new" },
  { pattern: "/retrofits/[id]", allowed: READ_ALL, path: (w) => `/retrofits/${w.retrofitId}` },
  {
    pattern: "/retrofits/[id]/compare",
    allowed: READ_ALL,
    path: (w) => `/retrofits/${w.retrofitId}/compare?a=${w.revision.released}&b=${w.revision.prepared}`,
  },
  { pattern: "/reviews", allowed: REVIEW_VIEW, path: () => "/reviews" },
  {
    pattern: "/revisions/[id]/review",
    allowed: READ_ALL,
    path: (w) => `/revisions/${w.revision.awaiting_check}/review`,
  },
  { pattern: "/settings", allowed: ANY, path: () => "/settings" },
  { pattern: "/captures", allowed: ANY, path: () => "/captures" },
  { pattern: "/captures/[id]", allowed: ANY, path: (w) => `/captures/${w.captureId}` },
  { pattern: "/field/retrofits/[id]", allowed: ANY, path: (w) => `/field/retrofits/${w.retrofitId}` },
  {
    pattern: "/field/revisions/[id]",
    allowed: FIELD_VIEW,
    path: (w) => `/field/revisions/${w.revision.released}`,
  },
  {
    pattern: "/field/revisions/[id]/print",
    allowed: FIELD_VIEW,
    path: (w) => `/field/revisions/${w.revision.released}/print`,
  },
  { pattern: "/revisions/[id]", allowed: ANY, path: (w) => `/revisions/${w.revision.released}` },
];
