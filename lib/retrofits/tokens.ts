// Personal API tokens of the signed-in user: made (secret shown once), listed
// (prefix only), revoked. Only the sha256 of a secret is stored.
import "server-only";
import { and, desc, eq, isNull } from "drizzle-orm";
import { db } from "@/db/client";
import { apiTokens } from "@/db/schema";
import { notFound } from "@/lib/api/errors";
import { recordAudit } from "@/lib/audit";
import { newTokenSecret } from "@/lib/auth/tokens";

export async function listTokensByUser({ userId }: { userId: number }) {
  return db
    .select({
      id: apiTokens.id,
      name: apiTokens.name,
      prefix: apiTokens.prefix,
      createdAt: apiTokens.createdAt,
      lastUsedAt: apiTokens.lastUsedAt,
      revokedAt: apiTokens.revokedAt,
    })
    .from(apiTokens)
    .where(eq(apiTokens.userId, userId))
    .orderBy(desc(apiTokens.createdAt), desc(apiTokens.id));
}

export async function createToken({ userId, name }: { userId: number; name: string }) {
  const t = newTokenSecret();
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(apiTokens)
      .values({ userId, name, tokenHash: t.hash, prefix: t.prefix })
      .returning({
        id: apiTokens.id,
        name: apiTokens.name,
        prefix: apiTokens.prefix,
        createdAt: apiTokens.createdAt,
      });
    await recordAudit(
      {
        actorId: userId,
        action: "token.create",
        subjectType: "api_token",
        subjectId: row.id,
        details: { name },
      },
      tx,
    );
    return { ...row, secret: t.secret };
  });
}

/** Revokes one of the user's own tokens; someone else's token is "not found". */
export async function revokeToken({ userId, id }: { userId: number; id: number }) {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(apiTokens)
      .set({ revokedAt: new Date() })
      .where(and(eq(apiTokens.id, id), eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)))
      .returning({ id: apiTokens.id });
    if (!row) throw notFound("Active token");
    await recordAudit(
      { actorId: userId, action: "token.revoke", subjectType: "api_token", subjectId: id },
      tx,
    );
    return row;
  });
}
