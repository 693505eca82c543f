import type { Metadata } from "next";
import Link from "next/link";
import { eq } from "drizzle-orm";
import { notFound } from "next/navigation";
import { db } from "@/db/client";
import { retrofits } from "@/db/schema";
import { FileDiff, type HighlightedRow } from "@/components/diff/file-diff";
import { AnchorCommentForm } from "@/components/review/anchor-comment-form";
import { CommentThread } from "@/components/review/comment-thread";
import { CommentAnchorProvider } from "@/components/review/comment-anchor-context";
import { revisionAnchors } from "@/lib/review/anchors";
import { toThreadView } from "@/lib/review/thread-view";
import { fileAnchor } from "@/lib/diff/anchor";
import { highlightLines } from "@/lib/highlight/shiki";
import { NumbersTable } from "@/components/diff/numbers-table";
import { EmulationOverlay } from "@/components/diff/emulation-overlay";
import { BoardTable } from "@/components/diff/board-table";
import { boardChanges } from "@/lib/diff/board";
import { RegisterTable } from "@/components/diff/register-table";
import { registerChanges } from "@/lib/diff/registers";
import { RevisionPicker } from "@/components/diff/revision-picker";
import { UnbuiltNotice } from "@/components/diff/unbuilt-notice";
import { unbuiltFilesSentence, unbuiltOf } from "@/lib/diff/unbuilt";
import { HazardCaution } from "@/components/ui/hazard-caution";
import { EmulationProof } from "@/components/review/emulation-proof";
import { loadEmulations } from "@/lib/revisions/load-emulations";
import { NotAllowed } from "@/components/ui/not-allowed";
import { ApiError } from "@/lib/api/errors";
import { pageUser } from "@/lib/auth/page";
import { READ_ALL } from "@/lib/auth/roles";
import { compareSnapshots } from "@/lib/diff";
import { defaultPair, loadPair, revisionsOf } from "@/lib/diff/load";
import type { DiffRow } from "@/lib/diff/types";
import { COMMENT_ROLES, listThreads } from "@/lib/review/comments";
import { STATE_WORDS } from "@/lib/review/words";

export const metadata: Metadata = { title: "Compare revisions" };

type Props = { params: Promise<{ id: string }>; searchParams: Promise<{ a?: string; b?: string }> };

const asId = (v?: string) => (v && /^(0|[1-9][0-9]{0,9})$/.test(v) ? Number(v) : undefined);

export default async function ComparePage({ params, searchParams }: Props) {
  const { user, allowed } = await pageUser(READ_ALL);
  if (!allowed) return <NotAllowed role={user.role} what="revision comparisons" />;
  const retrofitId = asId((await params).id);
  if (!retrofitId) notFound(); // 0 or not a number
  const [retrofit] = await db.select().from(retrofits).where(eq(retrofits.id, retrofitId));
  if (!retrofit) notFound();
  const q = await searchParams;
  const choices = await revisionsOf(retrofitId);
  const fallback = await defaultPair(retrofitId, asId(q.b));
  const aId = asId(q.a) ?? fallback?.a;
  const bId = asId(q.b) ?? fallback?.b;

  const heading = (
    <header className="mb-4">
      <p className="text-sm text-ink-muted">
        <Link href={`/retrofits/${retrofit.id}`} className="underline">
          {retrofit.name}
        </Link>{" "}
        · {retrofit.site} · <span className="num">{retrofit.assetTag}</span>
      </p>
      <h1 className="text-xl font-semibold">Compare revisions</h1>
    </header>
  );
  if (aId === undefined || !bId) {
    return (
      <section>
        {heading}
        <p className="panel">
          This retrofit has no revisions yet. Generate one on the retrofit page, then review its files here.
        </p>
      </section>
    );
  }

  let pair;
  try {
    pair = await loadPair(user, aId, bId);
  } catch (e) {
    if (e instanceof ApiError && (e.status === 404 || e.status === 422)) {
      return (
        <section>
          {heading}
          <p role="alert" className="panel border-hazard text-hazard">
            {e.message} Pick two revisions of this retrofit below.
          </p>
          <div className="mt-4">
            <RevisionPicker
              choices={choices}
              a={fallback?.a ?? choices[0]?.id ?? 0}
              b={fallback?.b ?? choices[0]?.id ?? 0}
            />
          </div>
        </section>
      );
    }
    throw e;
  }
  const { a, b } = pair;
  if (a.retrofitId !== retrofitId) notFound();
  const cmp = compareSnapshots(retrofitId, a, b);
  // A revision still building (or failed) has its plan but no files yet: the
  // numbers compare, the file text waits (else every file would show as gone).
  const unbuilt = unbuiltOf([a, b]);
  const filesReady = unbuilt.length === 0;
  const comments = (await listThreads(b.id)).map(toThreadView);
  const [emuA, emuB] = await Promise.all([a.number > 0 ? loadEmulations(a.id) : null, loadEmulations(b.id)]);
  const boardThreads = comments.filter((c) => !c.filePath);
  const canComment = COMMENT_ROLES.includes(user.role);
  const anchors = revisionAnchors(b);
  // Rows get a Comment button only for people who may comment, and only for an anchor the newer revision has.
  const anchorKeys = canComment ? anchors.map((x) => x.key) : undefined;

  const changed = filesReady ? cmp.files.filter((f) => f.status !== "unchanged") : [];
  const unchanged = filesReady ? cmp.files.filter((f) => f.status === "unchanged") : [];
  const files = await Promise.all(
    changed.map(async (f) => {
      const before = a.files.find((x) => x.path === f.path)?.content ?? "";
      const after = b.files.find((x) => x.path === f.path)?.content ?? "";
      const [oldHtml, newHtml] = await Promise.all([
        highlightLines(f.path, before),
        highlightLines(f.path, after),
      ]);
      const rows: HighlightedRow[] = f.rows.map((r: DiffRow) =>
        r.kind === "removed"
          ? { ...r, html: oldHtml[r.oldLine - 1] }
          : r.kind === "fold"
            ? { ...r, lines: newHtml.slice(r.newFrom - 1, r.newFrom - 1 + r.count) }
            : { ...r, html: newHtml[r.newLine - 1] },
      );
      const notes = comments.filter((c) => c.filePath === f.path);
      return { ...f, rows, notes };
    }),
  );
  const unchangedWithComments = comments.filter(
    (c) => c.filePath && unchanged.some((f) => f.path === c.filePath),
  );

  return (
    <section className="space-y-6">
      {heading}
      {(retrofit.mainsPowered || retrofit.drivesThyristor) && (
        <HazardCaution mainsPowered={retrofit.mainsPowered} drivesThyristor={retrofit.drivesThyristor} />
      )}
      <div className="flex flex-wrap items-end justify-between gap-4">
        <RevisionPicker choices={choices} a={a.id} b={b.id} />
        <div className="flex flex-wrap gap-2">
          {a.number > 0 && filesReady && (
            <a className="btn" href={`/api/v1/diff?a=${a.id}&b=${b.id}&format=patch`}>
              Download patch
            </a>
          )}
          <Link className="btn-primary" href={`/revisions/${b.id}/review`}>
            Review r{b.number}
          </Link>
        </div>
      </div>
      <p className="text-sm text-ink-soft">
        {a.number === 0
          ? "Nothing before"
          : `r${a.number} (${STATE_WORDS[a.state as keyof typeof STATE_WORDS]})`}{" "}
        → r{b.number} ({STATE_WORDS[b.state as keyof typeof STATE_WORDS]}). Comments go to r{b.number}
        {filesReady ? "; open a file and choose a line number to comment on it." : "."}
      </p>
      {unbuilt.map((r) => (
        <UnbuiltNotice key={r.id} revision={r} />
      ))}

      <CommentAnchorProvider>
        <section aria-labelledby="board-h">
          <h2 id="board-h" className="mb-2 text-lg font-semibold">
            What the board does
          </h2>
          <BoardTable targets={boardChanges(a, b)} a={a.number} b={b.number} anchorKeys={anchorKeys} />
        </section>

        <section aria-labelledby="registers-h">
          <h2 id="registers-h" className="mb-2 text-lg font-semibold">
            Registers the firmware writes
          </h2>
          <RegisterTable targets={registerChanges(a, b)} a={a.number} b={b.number} anchorKeys={anchorKeys} />
        </section>

        <section aria-labelledby="emulated-h" className="space-y-2">
          <h2 id="emulated-h" className="text-lg font-semibold">
            Emulated output beside the plan
          </h2>
          {emuA && emuA.buildState === "ready" && emuB && emuB.buildState === "ready" && (
            <EmulationOverlay
              folders={emuB.folders}
              older={{ number: a.number, emulations: emuA.emulations }}
              newer={{ number: b.number, emulations: emuB.emulations }}
              folded={emuB.folders.length > 2}
            />
          )}
          <div className="grid gap-4 lg:grid-cols-2">
            {[
              { rev: a, emu: emuA },
              { rev: b, emu: emuB },
            ].map(({ rev, emu }) =>
              emu && emu.buildState === "ready" ? (
                <EmulationProof
                  key={rev.id}
                  headingId={`emulated-r${rev.number}`}
                  number={rev.number}
                  folders={emu.folders}
                  emulations={emu.emulations}
                  unprovenReason={emu.unprovenReason}
                  folded={emu.folders.length > 2}
                />
              ) : rev.number > 0 ? (
                <p key={rev.id} className="panel text-sm text-ink-soft">
                  r{rev.number} has no built images yet, so nothing was emulated.
                </p>
              ) : null,
            )}
          </div>
        </section>

        <section aria-labelledby="board-comments-h" className="space-y-2">
          <h2 id="board-comments-h" className="text-lg font-semibold">
            Comments on timing and registers ({boardThreads.length})
          </h2>
          {boardThreads.length === 0 && (
            <p className="text-sm text-ink-soft">
              None yet. Use a row&apos;s Comment button above, or pick a quantity or register below.
            </p>
          )}
          {boardThreads.map((t) => (
            <CommentThread key={t.id} thread={t} revisionId={b.id} canComment={canComment} />
          ))}
          {canComment && <AnchorCommentForm revisionId={b.id} anchors={anchors} />}
        </section>

        <section aria-labelledby="numbers-h">
          <h2 id="numbers-h" className="mb-2 text-lg font-semibold">
            Numbers that changed
          </h2>
          <NumbersTable rows={cmp.numbers} a={a.number} b={b.number} anchorKeys={anchorKeys} />
        </section>
      </CommentAnchorProvider>

      {!filesReady && (
        <section aria-labelledby="files-h" className="space-y-2">
          <h2 id="files-h" className="text-lg font-semibold">
            Files
          </h2>
          <p className="panel text-ink-soft">
            {unbuiltFilesSentence(unbuilt)} The files are compared once both revisions are built.
          </p>
        </section>
      )}

      {filesReady && (
        <section aria-labelledby="files-h" className="space-y-4">
          <h2 id="files-h" className="text-lg font-semibold">
            Files ({changed.length} changed, {unchanged.length} unchanged)
          </h2>
          {changed.length === 0 && <p className="panel text-ink-soft">Every file is byte-identical.</p>}
          {changed.length > 0 && (
            <nav aria-label="File index" className="panel">
              <p className="mb-1 text-sm text-ink-soft">
                Each file opens on its own; a name below jumps to it and opens it.
              </p>
              <ul className="num columns-1 text-sm sm:columns-2">
                {files.map((f) => (
                  <li key={f.path}>
                    <a className="underline" href={`#${fileAnchor(f.path)}`}>
                      {f.path}
                    </a>{" "}
                    <span className="text-ink-muted">
                      ({f.added} new, {f.removed} gone{f.notes.length ? `, ${f.notes.length} comment(s)` : ""}
                      )
                    </span>
                  </li>
                ))}
              </ul>
            </nav>
          )}
          {files.map((f) => (
            <FileDiff
              key={f.path}
              path={f.path}
              status={f.status}
              added={f.added}
              removed={f.removed}
              rows={f.rows}
              revisionId={b.id}
              canComment={canComment}
              comments={f.notes}
            />
          ))}
          {unchanged.length > 0 && (
            <details className="panel">
              <summary className="cursor-pointer text-sm">{unchanged.length} unchanged files</summary>
              <ul className="num mt-2 text-sm">
                {unchanged.map((f) => (
                  <li key={f.path}>{f.path}</li>
                ))}
              </ul>
            </details>
          )}
          {unchangedWithComments.length > 0 && (
            <p className="text-sm text-ink-soft">
              {unchangedWithComments.length} comment(s) sit on unchanged files; see the{" "}
              <Link href={`/revisions/${b.id}/review`} className="underline">
                review page
              </Link>
              .
            </p>
          )}
        </section>
      )}
    </section>
  );
}
