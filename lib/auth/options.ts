// next-auth configuration: credentials against bcrypt hashes in the database,
// JWT sessions carrying the user's id and role.
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { eq } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db/client";
import { users, type Role } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import { verifyPassword } from "./password";
import { clearFailures, lockedUntil, recordFailure } from "./throttle";
import { endSessions } from "./sessions";

const credentials = z.object({
  email: z.string().trim().toLowerCase().email(),
  password: z.string().min(1).max(200),
});

// Messages shown on the sign-in page (next-auth passes the thrown message as ?error=).
export const SIGN_IN_ERRORS = {
  invalid: "Wrong e-mail or password.",
  locked: "Too many failed attempts. Wait 15 minutes, or ask an admin.",
  disabled: "This account is disabled. Ask an admin.",
} as const;

export const SESSION_MAX_AGE_S = 8 * 60 * 60;
/** A session ends this long after sign-in however often it is used (the cookie is re-issued on use, its end is not). */
export const SESSION_ABSOLUTE_S = 8 * 60 * 60;

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_S },
  pages: { signIn: "/sign-in" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: {
        email: { label: "E-mail", type: "email" },
        password: { label: "Password", type: "password" },
      },
      async authorize(raw) {
        const parsed = credentials.safeParse(raw);
        if (!parsed.success) throw new Error(SIGN_IN_ERRORS.invalid);
        const { email, password } = parsed.data;
        if (await lockedUntil(email)) throw new Error(SIGN_IN_ERRORS.locked);
        const [user] = await db.select().from(users).where(eq(users.email, email));
        const ok = await verifyPassword(password, user?.passwordHash);
        if (!user || !ok) {
          await recordFailure(email);
          await recordAudit({ actorId: user?.id ?? null, action: "sign-in-failed", details: { email } });
          throw new Error(SIGN_IN_ERRORS.invalid);
        }
        if (user.disabled) throw new Error(SIGN_IN_ERRORS.disabled);
        await clearFailures(email);
        await recordAudit({ actorId: user.id, action: "sign-in", subjectType: "user", subjectId: user.id });
        return {
          id: String(user.id),
          email: user.email,
          name: user.name,
          role: user.role,
          sessionVersion: user.sessionVersion,
        };
      },
    }),
  ],
  events: {
    // Sign-out ends this user's sessions on the server too: a copied cookie
    // stops working (the version check in guard.ts), not only this browser's.
    async signOut({ token }) {
      const uid = (token as { uid?: unknown } | null)?.uid;
      if (typeof uid === "number") await endSessions(uid);
    },
  },
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.uid = Number(user.id);
        token.role = (user as { role: Role }).role;
        token.sv = (user as unknown as { sessionVersion: number }).sessionVersion;
        token.authAt = Date.now();
      }
      return token;
    },
    async session({ session, token }) {
      if (session.user) {
        session.user.id = token.uid;
        session.user.role = token.role;
      }
      return session;
    },
  },
};
