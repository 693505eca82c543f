// Comments on a revision, optionally anchored to a file and a line of that
// revision's files. Admins, engineers and reviewers comment (engineers answer
// the reviewer); technicians do not.
import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db/client";
import { comments, revisionFiles, users } from "@/db/schema";
import { ApiError } from "@/lib/api/errors";
import { recordAudit } from "@/lib/audit";
import type { AuthUser } from "@/lib/auth/guard";
import { READ_ALL } from "@/lib/auth/roles";
import { lineCount } from "@/lib/diff/files";
import { loadRevisionForReview } from "./load";

export const COMMENT_ROLES = READ_ALL;

export const commentInput = z
  .object({
    body: z.string().trim().min(1, "Write the comment.").max(4000, "Keep a comment under 4000 characters."),
    filePath: z.string().trim().min(1).max(300).nullish(),
    line: z.coerce.number().int().positive("Lines count from 1.").nullish(),
  })
  .refine((c) => !c.line || c.filePath, { message: "A line needs a file.", path: ["line"] });

export type CommentInput = z.infer<typeof commentInput>;

export async function listComments(revisionId: number) {
  return db
    .select({
      id: comments.id,
      body: comments.body,
      filePath: comments.filePath,
      line: comments.line,
      createdAt: comments.createdAt,
      author: users.name,
      authorId: comments.authorId,
    })
    .from(comments)
    .innerJoin(users, eq(users.id, comments.authorId))
    .where(eq(comments.revisionId, revisionId))
    .orderBy(asc(comments.createdAt), asc(comments.id));
}

export type CommentView = Awaited<ReturnType<typeof listComments>>[number];

export async function addComment(user: AuthUser, revisionId: number, input: CommentInput) {
  if (!COMMENT_ROLES.includes(user.role))
    throw new ApiError("forbidden", `The ${user.role} role may not comment.`);
  return db.transaction(async (tx) => {
    const { revision } = await loadRevisionForReview(revisionId, tx);
    const filePath = input.filePath ?? null;
    const line = input.line ?? null;
    if (filePath) {
      const [file] = await tx
        .select({ content: revisionFiles.content })
        .from(revisionFiles)
        .where(and(eq(revisionFiles.revisionId, revisionId), eq(revisionFiles.path, filePath)));
      if (!file)
        throw new ApiError("unprocessable", `r${revision.number} has no file ${filePath}.`, {
          filePath: "No such file.",
        });
      const lines = lineCount(file.content);
      if (line && line > lines) {
        throw new ApiError("unprocessable", `${filePath} has ${lines} lines in r${revision.number}.`, {
          line: `At most ${lines}.`,
        });
      }
    }
    const [row] = await tx
      .insert(comments)
      .values({ revisionId, authorId: user.id, body: input.body, filePath, line })
      .returning();
    await recordAudit(
      {
        actorId: user.id,
        action: "comment.add",
        subjectType: "revision",
        subjectId: revisionId,
        details: { commentId: row.id, number: revision.number, filePath, line },
      },
      tx,
    );
    return { ...row, author: user.name };
  });
}
