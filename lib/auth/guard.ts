// The one server-side gate. Every route handler, server action and page asks
// it for the user and the roles allowed; nothing relies on hidden buttons.
import { and, eq, isNull } from "drizzle-orm";
import { getServerSession } from "next-auth";
import { getToken } from "next-auth/jwt";
import { cookies, headers } from "next/headers";
import { db } from "@/db/client";
import { apiTokens, users, type Role } from "@/db/schema";
import { ApiError } from "@/lib/api/errors";
import { authOptions } from "./options";
import { hashToken, TOKEN_PREFIX } from "./tokens";
import { sessionStillValid } from "./sessions";

export type AuthUser = {
  id: number;
  email: string;
  name: string;
  role: Role;
  site: string | null;
  via: "session" | "token";
};

/** The signed-in user from the session cookie, re-read from the database so a
 *  role change or a disabled account takes effect at once. */
export async function sessionUser(): Promise<AuthUser | null> {
  const session = await getServerSession(authOptions);
  const id = session?.user?.id;
  if (typeof id !== "number") return null;
  // The cookie's own claims: version and sign-in time (lib/auth/sessions.ts).
  const cookieList = (await cookies()).getAll();
  const claims = await getToken({
    req: {
      headers: Object.fromEntries((await headers()).entries()),
      cookies: Object.fromEntries(cookieList.map((c) => [c.name, c.value])),
    } as never,
  });
  const [u] = await db.select().from(users).where(eq(users.id, id));
  if (!u || u.disabled || !claims || !sessionStillValid(u, claims)) return null;
  return { id: u.id, email: u.email, name: u.name, role: u.role, site: u.site, via: "session" };
}

// last_used_at is written at most once a minute per token: a busy script
// would otherwise serialise its own requests on that row's lock.
const LAST_USED_RESOLUTION_MS = 60_000;

async function tokenUser(header: string): Promise<AuthUser | null> {
  const secret = header.slice("Bearer ".length).trim();
  if (!secret.startsWith(TOKEN_PREFIX)) return null;
  const [row] = await db
    .select({ tokenId: apiTokens.id, lastUsedAt: apiTokens.lastUsedAt, user: users })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, hashToken(secret)), isNull(apiTokens.revokedAt)));
  if (!row || row.user.disabled) return null;
  const now = Date.now();
  if (!row.lastUsedAt || now - row.lastUsedAt.getTime() > LAST_USED_RESOLUTION_MS) {
    await db
      .update(apiTokens)
      .set({ lastUsedAt: new Date(now) })
      .where(eq(apiTokens.id, row.tokenId));
  }
  const u = row.user;
  return { id: u.id, email: u.email, name: u.name, role: u.role, site: u.site, via: "token" };
}

/** Bearer token when the request carries one, else the session. */
export async function requestUser(req?: Request): Promise<AuthUser | null> {
  const header = req?.headers.get("authorization");
  if (header?.startsWith("Bearer ")) return tokenUser(header);
  return sessionUser();
}

/** Throws 401 when nobody is signed in, 403 when the role is not in `roles`. */
export async function requireUser(opts: { roles: readonly Role[]; req?: Request }): Promise<AuthUser> {
  const user = await requestUser(opts.req);
  if (!user) throw new ApiError("unauthenticated", "Sign in first, or send a valid API token.");
  if (!opts.roles.includes(user.role)) {
    throw new ApiError("forbidden", `The ${user.role} role may not do this.`);
  }
  return user;
}
