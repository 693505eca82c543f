// On the compare page, for a revision whose build is not done: a plain
// statement of its build state (with the failure's reason) and each target's
// step, so the reader knows why the file text is missing. The stage, plan and
// register numbers above and below come from the plan, which exists from the
// moment the revision is generated.
import Link from "next/link";
import { unbuiltSentence } from "@/lib/diff/unbuilt";
import {
  BUILD_STEP_WORDS,
  progressList,
  type BuildProgress,
  type BuildState,
} from "@/lib/revisions/build-state";

export type UnbuiltRevision = {
  id: number;
  number: number;
  buildState: Exclude<BuildState, "ready">;
  buildError: string | null;
  buildProgress: unknown;
};

export function UnbuiltNotice({ revision: r }: { revision: UnbuiltRevision }) {
  const targets = progressList((r.buildProgress ?? {}) as BuildProgress);
  return (
    <section
      aria-label={`Build of r${r.number}`}
      className={`panel space-y-2 ${r.buildState === "failed" ? "border-hazard" : ""}`}
      data-testid="unbuilt-notice"
    >
      <p role={r.buildState === "failed" ? "alert" : "status"}>
        <span className="font-semibold">{unbuiltSentence(r)}</span>
        {r.buildState === "failed" ? (
          <>
            : {r.buildError ?? "no reason was recorded."} It has no files or images; its numbers below are the
            plan it was made from. Fix the cause and generate a new revision.
          </>
        ) : (
          <>
            : a worker is compiling its targets. Its numbers below are the plan it was made from; its file
            text shows here once it is built (reload the page, or follow it live on the{" "}
            <Link className="underline" href={`/revisions/${r.id}`}>
              revision page
            </Link>
            ).
          </>
        )}
      </p>
      {targets.length > 0 && (
        <ul className="text-sm">
          {targets.map((t) => (
            <li key={t.folder}>
              <span className="num">{t.folder}/</span> ({t.device}): {BUILD_STEP_WORDS[t.step]}
              {t.reason ? <> — {t.reason}</> : null}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
