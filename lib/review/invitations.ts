// Invitations: an admin names an e-mail, name, role and site; the person gets a
// one-time link (32 random bytes, only the sha256 stored) valid for 7 days and
// sets their own password. Using the link is a conditional UPDATE, so a link
// works exactly once even when clicked twice at the same moment.
import "server-only";
import { randomBytes } from "node:crypto";
import { and, desc, eq, gt, isNull, sql } from "drizzle-orm";
import { z } from "zod";
import { lineText } from "@/lib/validation/plain-text";
import { db } from "@/db/client";
import { invitations, users } from "@/db/schema";
import { ApiError, isUniqueViolation } from "@/lib/api/errors";
import { recordAudit } from "@/lib/audit";
import type { AuthUser } from "@/lib/auth/guard";
import { hashPassword } from "@/lib/auth/password";
import { ROLES } from "@/lib/auth/roles";
import { hashToken } from "@/lib/auth/tokens";
import { invitationMail } from "@/lib/mail/messages";
import { enqueueMail } from "@/lib/mail/outbox";

export const INVITATION_DAYS = 7;
export const MIN_PASSWORD = 10;

export const invitationInput = z
  .object({
    email: z.string().trim().toLowerCase().email("Enter an e-mail address."),
    name: lineText("The person's name", { min: 1, max: 200 }),
    role: z.enum(ROLES, { message: "Choose a role." }),
    site: z.nullish(lineText("Site", { max: 200 })).transform((s) => (s ? s : null)),
  })
  .strict();

export const acceptInput = z
  .object({
    token: z.string().min(20).max(200),
    password: z
      .string()
      .min(MIN_PASSWORD, `Use at least ${MIN_PASSWORD} characters.`)
      .max(200, "Use at most 200 characters."),
  })
  .strict();

export async function createInvitation(admin: AuthUser, raw: unknown) {
  const input = invitationInput.parse(raw);
  const token = randomBytes(32).toString("base64url");
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 86_400_000);
  const row = await db.transaction(async (tx) => {
    const [existing] = await tx.select({ id: users.id }).from(users).where(eq(users.email, input.email));
    if (existing)
      throw new ApiError("conflict", `${input.email} already has an account.`, {
        email: "Already has an account.",
      });
    const [inv] = await tx
      .insert(invitations)
      .values({ ...input, tokenHash: hashToken(token), invitedBy: admin.id, expiresAt })
      .returning();
    await recordAudit(
      {
        actorId: admin.id,
        action: "invitation.create",
        subjectType: "invitation",
        subjectId: inv.id,
        details: { email: input.email, role: input.role, site: input.site },
      },
      tx,
    );
    await enqueueMail(
      [
        invitationMail({
          to: input,
          role: input.role,
          invitedBy: { name: admin.name, email: admin.email },
          token,
          expiresAt,
        }),
      ],
      tx,
    );
    return inv;
  });
  return { invitation: publicInvitation(row), token };
}

export async function pendingInvitations() {
  const rows = await db
    .select()
    .from(invitations)
    .where(and(isNull(invitations.usedAt), gt(invitations.expiresAt, sql`now()`)))
    .orderBy(desc(invitations.createdAt));
  return rows.map(publicInvitation);
}

/** The open invitation behind a link, or null (unknown, used or expired). */
export async function openInvitation(token: string) {
  const [row] = await db
    .select()
    .from(invitations)
    .where(
      and(
        eq(invitations.tokenHash, hashToken(token)),
        isNull(invitations.usedAt),
        gt(invitations.expiresAt, sql`now()`),
      ),
    );
  return row ? publicInvitation(row) : null;
}

export async function acceptInvitation(raw: unknown) {
  const { token, password } = acceptInput.parse(raw);
  const passwordHash = await hashPassword(password);
  // Two invitations for one e-mail accepted at the same moment both pass the
  // "taken" check; the users.email unique index stops the second insert.
  return acceptOnce(token, passwordHash).catch((err: unknown) => {
    if (isUniqueViolation(err))
      throw new ApiError("conflict", "This e-mail address already has an account; sign in instead.", {
        token: "The account for this invitation's e-mail already exists.",
      });
    throw err;
  });
}

async function acceptOnce(token: string, passwordHash: string) {
  return db.transaction(async (tx) => {
    const [inv] = await tx
      .update(invitations)
      .set({ usedAt: new Date() })
      .where(
        and(
          eq(invitations.tokenHash, hashToken(token)),
          isNull(invitations.usedAt),
          gt(invitations.expiresAt, sql`now()`),
        ),
      )
      .returning();
    if (!inv)
      throw new ApiError(
        "not_found",
        "This link is not valid any more: it was used, it expired, or it is incomplete. Ask an admin for a new invitation.",
      );
    const [taken] = await tx.select({ id: users.id }).from(users).where(eq(users.email, inv.email));
    if (taken) throw new ApiError("conflict", `${inv.email} already has an account; sign in instead.`);
    const [user] = await tx
      .insert(users)
      .values({ email: inv.email, name: inv.name, role: inv.role, site: inv.site, passwordHash })
      .returning();
    await recordAudit(
      {
        actorId: user.id,
        action: "invitation.accept",
        subjectType: "user",
        subjectId: user.id,
        details: { invitationId: inv.id, role: inv.role },
      },
      tx,
    );
    return { id: user.id, email: user.email, name: user.name, role: user.role };
  });
}

function publicInvitation(i: typeof invitations.$inferSelect) {
  return {
    id: i.id,
    email: i.email,
    name: i.name,
    role: i.role,
    site: i.site,
    expiresAt: i.expiresAt,
    usedAt: i.usedAt,
    createdAt: i.createdAt,
  };
}
