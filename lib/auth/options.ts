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
import { claimSignInAttempt, clientAddress, recordSignInSuccess } from "./throttle";
import { endSessions } from "./sessions";

const credentials = z.object({
  email: z.string().trim().toLowerCase().email(),
  password: z.string().min(1).max(200),
});

// Messages shown on the sign-in page (next-auth passes the thrown message as ?error=).
// A disabled account gets the same answer as a wrong password, whether or not
// the password was right, so the answer tells a stranger nothing about the
// account; the wording names both causes for the person it concerns.
export const SIGN_IN_ERRORS = {
  invalid: "Wrong e-mail or password, or the account is disabled (ask an admin).",
  wait: (seconds: number) =>
    `Too many failed attempts. Wait ${seconds} second${seconds === 1 ? "" : "s"}, then try again, or ask an admin.`,
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
      async authorize(raw, req) {
        const parsed = credentials.safeParse(raw);
        if (!parsed.success) throw new Error(SIGN_IN_ERRORS.invalid);
        const { email, password } = parsed.data;
        const address = clientAddress(req?.headers);
        const wait = await claimSignInAttempt(email, address);
        if (wait > 0) throw new Error(SIGN_IN_ERRORS.wait(wait));
        const [user] = await db.select().from(users).where(eq(users.email, email));
        const ok = await verifyPassword(password, user?.passwordHash);
        if (!user || !ok || user.disabled) {
          await recordAudit({
            actorId: user?.id ?? null,
            action: "sign-in-failed",
            details: { email, address, ...(ok && user?.disabled ? { disabled: true } : {}) },
          });
          throw new Error(SIGN_IN_ERRORS.invalid);
        }
        await recordSignInSuccess(email, address);
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
