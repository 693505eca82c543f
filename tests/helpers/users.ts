// Test users straight in the database, each with a unique e-mail so test files
// can run in parallel against the one test database.
import { randomBytes } from "node:crypto";
import { db } from "@/db/client";
import { apiTokens, users, type Role } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { newTokenSecret } from "@/lib/auth/tokens";

export const TEST_PASSWORD = "test-pass-4k7";

export async function makeUser(role: Role, opts: { site?: string; disabled?: boolean } = {}) {
  const email = `${role}-${randomBytes(5).toString("hex")}@test.invalid`;
  const [row] = await db
    .insert(users)
    .values({
      email,
      name: `Test ${role}`,
      role,
      site: opts.site ?? null,
      disabled: opts.disabled ?? false,
      passwordHash: await hashPassword(TEST_PASSWORD),
    })
    .returning();
  return { ...row, password: TEST_PASSWORD };
}

export async function makeToken(userId: number): Promise<string> {
  const t = newTokenSecret();
  await db.insert(apiTokens).values({ userId, name: "test", tokenHash: t.hash, prefix: t.prefix });
  return t.secret;
}

export const DEMO = {
  admin: { email: "admin@ostberg.test", password: "admin-demo-pass" },
  engineer: { email: "engineer@ostberg.test", password: "engineer-demo-pass" },
  reviewer: { email: "reviewer@ostberg.test", password: "reviewer-demo-pass" },
  technician: { email: "technician@ostberg.test", password: "technician-demo-pass" },
} as const;
