// Comments on a revision. A thread starts with a comment anchored to the
// revision, a file, a line of a file, a target's quantity or a register
// (lib/review/anchors.ts); replies hang off the first comment; the thread is
// resolved and reopened as a whole. A thread open when a later revision of the
// same retrofit was generated is shown on that revision too ("carried"), at
// the place its anchor now has, marked "changed" when the anchored value or
// line differs and "gone" when the anchor no longer exists. Admins, engineers
// and reviewers comment (engineers answer the reviewer); technicians do not.
import "server-only";
import { and, asc, eq, gt, inArray, isNull, lte, or } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { z } from "zod";
import { db } from "@/db/client";
import { comments, revisionFiles, revisions, users } from "@/db/schema";
import { ApiError } from "@/lib/api/errors";
import { recordAudit } from "@/lib/audit";
import type { AuthUser } from "@/lib/auth/guard";
import { READ_ALL } from "@/lib/auth/roles";
import { lineCount } from "@/lib/diff/files";
import { dbId } from "@/lib/validation/id";
import { optionalPlainNumber } from "@/lib/validation/plain-number";
import { lineText, paragraphText } from "@/lib/validation/plain-text";
import { carryLine, carryMark, revisionAnchors, type AnchorKind, type CarryMark } from "./anchors";
import { loadRevisionForReview } from "./load";
import { lockLiveRetrofit } from "@/lib/retrofits/live-lock";

export const COMMENT_ROLES = READ_ALL;

export const commentInput = z
  .object({
    body: paragraphText("The comment", { min: 1, max: 4000 }),
    filePath: z.nullish(lineText("filePath", { min: 1, max: 300 })),
    line: optionalPlainNumber(
      "A line is a whole number",
      z.number().int("A line is a whole number.").positive("Lines count from 1."),
    ),
    /** "quantity" | "register" with anchorKey; line and file anchors are given by filePath / line */
    anchorKind: z.enum(["revision", "file", "line", "quantity", "register"]).nullish(),
    anchorKey: z.nullish(lineText("anchorKey", { min: 1, max: 200 })),
    /** reply to this thread (its first comment); a reply has no anchor of its own */
    parentId: dbId.nullish(),
  })
  .strict()
  .refine((c) => !c.line || c.filePath, { message: "A line needs a file.", path: ["line"] })
  .refine((c) => !(c.anchorKind === "quantity" || c.anchorKind === "register") || c.anchorKey, {
    message: "Name the quantity or register the comment is about.",
    path: ["anchorKey"],
  })
  .refine((c) => !c.parentId || (!c.filePath && !c.anchorKey), {
    message: "A reply sits in its thread; leave filePath and anchorKey out.",
    path: ["parentId"],
  });

export type CommentInput = z.infer<typeof commentInput>;

export const resolveInput = z
  .object({ resolved: z.boolean({ message: "resolved: send true or false." }) })
  .strict();

const resolver = alias(users, "resolver");

const commentColumns = {
  id: comments.id,
  revisionId: comments.revisionId,
  body: comments.body,
  filePath: comments.filePath,
  line: comments.line,
  anchorKind: comments.anchorKind,
  anchorKey: comments.anchorKey,
  anchorText: comments.anchorText,
  parentId: comments.parentId,
  resolvedAt: comments.resolvedAt,
  resolvedBy: resolver.name,
  createdAt: comments.createdAt,
  author: users.name,
  authorId: comments.authorId,
};

/** Every comment written on this revision (threads and replies), oldest first. */
export async function listComments(revisionId: number) {
  return db
    .select(commentColumns)
    .from(comments)
    .innerJoin(users, eq(users.id, comments.authorId))
    .leftJoin(resolver, eq(resolver.id, comments.resolvedBy))
    .where(eq(comments.revisionId, revisionId))
    .orderBy(asc(comments.createdAt), asc(comments.id));
}

export type CommentView = Awaited<ReturnType<typeof listComments>>[number];

export type Reply = { id: number; body: string; author: string; createdAt: Date; revisionNumber: number };

export type Thread = {
  id: number;
  body: string;
  author: string;
  createdAt: Date;
  anchorKind: AnchorKind;
  anchorKey: string | null;
  /** what the anchor is called on this revision ("Target 1 period", "src/main.c line 12") */
  anchorLabel: string;
  /** file and line on this revision (a carried line anchor is moved to where the line is now) */
  filePath: string | null;
  line: number | null;
  /** the revision the thread was started on */
  originNumber: number;
  carried: boolean;
  /** null on the revision the thread was started on */
  mark: CarryMark | null;
  resolvedAt: Date | null;
  resolvedBy: string | null;
  replies: Reply[];
};

type Row = CommentView & { revisionNumber: number };

/** Threads shown on a revision: its own and those carried from earlier revisions of the retrofit. */
export async function listThreads(revisionId: number): Promise<Thread[]> {
  const [rev] = await db
    .select({
      id: revisions.id,
      retrofitId: revisions.retrofitId,
      number: revisions.number,
      createdAt: revisions.createdAt,
      plans: revisions.plans,
      spec: revisions.spec,
    })
    .from(revisions)
    .where(eq(revisions.id, revisionId));
  if (!rev) return [];
  // Roots of this revision, and roots of earlier ones still open when it was generated.
  const roots: Row[] = await db
    .select({ ...commentColumns, revisionNumber: revisions.number })
    .from(comments)
    .innerJoin(revisions, eq(revisions.id, comments.revisionId))
    .innerJoin(users, eq(users.id, comments.authorId))
    .leftJoin(resolver, eq(resolver.id, comments.resolvedBy))
    .where(
      and(
        eq(revisions.retrofitId, rev.retrofitId),
        isNull(comments.parentId),
        or(
          eq(revisions.id, rev.id),
          and(
            lte(revisions.number, rev.number),
            or(isNull(comments.resolvedAt), gt(comments.resolvedAt, rev.createdAt)),
          ),
        ),
      ),
    )
    .orderBy(asc(comments.createdAt), asc(comments.id));
  const shown = roots.filter((r) => r.revisionNumber <= rev.number);
  if (shown.length === 0) return [];
  const replies = await db
    .select({ ...commentColumns, revisionNumber: revisions.number })
    .from(comments)
    .innerJoin(revisions, eq(revisions.id, comments.revisionId))
    .innerJoin(users, eq(users.id, comments.authorId))
    .leftJoin(resolver, eq(resolver.id, comments.resolvedBy))
    .where(
      inArray(
        comments.parentId,
        shown.map((r) => r.id),
      ),
    )
    .orderBy(asc(comments.createdAt), asc(comments.id));

  const anchors = revisionAnchors(rev);
  // File texts needed to move carried line anchors: this revision's and each origin's.
  const carriedFiles = shown.filter((r) => r.revisionId !== rev.id && r.filePath);
  const wanted = new Set([rev.id, ...carriedFiles.map((r) => r.revisionId)]);
  const paths = [...new Set(carriedFiles.map((r) => r.filePath!))];
  const texts = new Map<string, string>();
  if (paths.length)
    for (const f of await db
      .select({
        revisionId: revisionFiles.revisionId,
        path: revisionFiles.path,
        content: revisionFiles.content,
      })
      .from(revisionFiles)
      .where(and(inArray(revisionFiles.revisionId, [...wanted]), inArray(revisionFiles.path, paths))))
      texts.set(`${f.revisionId}:${f.path}`, f.content);

  return shown.map((r): Thread => {
    const carried = r.revisionId !== rev.id;
    let mark: CarryMark | null = null;
    let line = r.line;
    let label = "the whole revision";
    if (r.anchorKind === "quantity" || r.anchorKind === "register") {
      const a = anchors.find((x) => x.key === r.anchorKey);
      label = a?.label ?? r.anchorKey ?? "";
      if (carried) mark = carryMark(anchors, r.anchorKey ?? "", r.anchorText);
    } else if (r.filePath) {
      if (carried) {
        const before = texts.get(`${r.revisionId}:${r.filePath}`);
        const after = texts.get(`${rev.id}:${r.filePath}`);
        if (r.line) {
          const moved = carryLine(before, after, r.line);
          mark = moved.mark;
          line = moved.line;
        } else mark = after === undefined ? "gone" : before === after ? "same" : "changed";
      }
      label = line ? `${r.filePath} line ${line}` : r.filePath;
    } else if (carried) mark = "same";
    return {
      id: r.id,
      body: r.body,
      author: r.author,
      createdAt: r.createdAt,
      anchorKind: r.anchorKind,
      anchorKey: r.anchorKey,
      anchorLabel: label,
      filePath: mark === "gone" ? null : r.filePath,
      line: mark === "gone" ? null : line,
      originNumber: r.revisionNumber,
      carried,
      mark,
      resolvedAt: r.resolvedAt,
      resolvedBy: r.resolvedBy,
      replies: replies
        .filter((x) => x.parentId === r.id)
        .map((x) => ({
          id: x.id,
          body: x.body,
          author: x.author,
          createdAt: x.createdAt,
          revisionNumber: x.revisionNumber,
        })),
    };
  });
}

export async function addComment(user: AuthUser, revisionId: number, input: CommentInput) {
  if (!COMMENT_ROLES.includes(user.role))
    throw new ApiError("forbidden", `The ${user.role} role may not comment.`);
  return db.transaction(async (tx) => {
    const { revision, retrofit } = await loadRevisionForReview(revisionId, tx);
    await lockLiveRetrofit(tx, retrofit.id, `comment on r${revision.number}`);
    const filePath = input.parentId ? null : (input.filePath ?? null);
    const line = filePath ? (input.line ?? null) : null;
    let anchorKind: AnchorKind = line ? "line" : filePath ? "file" : "revision";
    let anchorKey: string | null = null;
    let anchorText: string | null = null;
    let parentId: number | null = null;
    if (input.parentId) {
      const thread = (await listThreads(revisionId)).find((t) => t.id === input.parentId);
      if (!thread)
        throw new ApiError("unprocessable", `r${revision.number} shows no thread ${input.parentId}.`, {
          parentId: "No such thread on this revision.",
        });
      parentId = thread.id;
    } else if (input.anchorKind === "quantity" || input.anchorKind === "register") {
      const [row] = await tx
        .select({ plans: revisions.plans, spec: revisions.spec })
        .from(revisions)
        .where(eq(revisions.id, revisionId));
      const anchor = revisionAnchors(row).find(
        (a) => a.key === input.anchorKey && a.kind === input.anchorKind,
      );
      if (!anchor)
        throw new ApiError(
          "unprocessable",
          `r${revision.number} has no ${input.anchorKind} ${input.anchorKey}.`,
          {
            anchorKey: `No such ${input.anchorKind} on r${revision.number}.`,
          },
        );
      anchorKind = anchor.kind;
      anchorKey = anchor.key;
      anchorText = anchor.text;
    }
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
      anchorText = line ? (file.content.split("\n")[line - 1] ?? "") : null;
    }
    const [row] = await tx
      .insert(comments)
      .values({
        revisionId,
        authorId: user.id,
        body: input.body,
        filePath,
        line,
        anchorKind,
        anchorKey,
        anchorText,
        parentId,
      })
      .returning();
    await recordAudit(
      {
        actorId: user.id,
        action: parentId ? "comment.reply" : "comment.add",
        subjectType: "revision",
        subjectId: revisionId,
        details: {
          commentId: row.id,
          number: revision.number,
          filePath,
          line,
          anchorKind,
          anchorKey,
          parentId,
        },
      },
      tx,
    );
    return { ...row, author: user.name };
  });
}

/** Resolves or reopens a thread (its first comment); a reply id is refused naming the field. */
export async function setResolved(user: AuthUser, commentId: number, resolved: boolean) {
  if (!COMMENT_ROLES.includes(user.role))
    throw new ApiError("forbidden", `The ${user.role} role may not resolve comments.`);
  return db.transaction(async (tx) => {
    const [c] = await tx
      .select({ id: comments.id, parentId: comments.parentId, revisionId: comments.revisionId })
      .from(comments)
      .where(eq(comments.id, commentId))
      .for("update");
    if (!c) throw new ApiError("not_found", "No such comment.");
    const { revision, retrofit } = await loadRevisionForReview(c.revisionId, tx);
    await lockLiveRetrofit(
      tx,
      retrofit.id,
      `${resolved ? "resolve" : "reopen"} threads of r${revision.number}`,
    );
    if (c.parentId)
      throw new ApiError("unprocessable", "A reply is resolved with its thread.", {
        resolved: `Resolve thread ${c.parentId} instead.`,
      });
    const now = new Date();
    const [row] = await tx
      .update(comments)
      .set(resolved ? { resolvedAt: now, resolvedBy: user.id } : { resolvedAt: null, resolvedBy: null })
      .where(eq(comments.id, commentId))
      .returning();
    await recordAudit(
      {
        actorId: user.id,
        action: resolved ? "comment.resolve" : "comment.reopen",
        subjectType: "revision",
        subjectId: c.revisionId,
        details: { commentId },
      },
      tx,
    );
    return row;
  });
}
