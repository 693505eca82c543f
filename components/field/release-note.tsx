import { revisionReviews } from "@/lib/review/history";

/** The checker's words on the release, shown to the technician before the check form:
 *  the release note and, when a budget was missed, the recorded reason for releasing anyway. */
export async function ReleaseNote({ revisionId }: { revisionId: number }) {
  const release = (await revisionReviews(revisionId)).filter((r) => r.decision === "release").at(-1);
  if (!release || (!release.note && !release.overrideReason)) return null;
  return (
    <section className="panel space-y-1" aria-labelledby="release-note-h" data-testid="release-note">
      <h2 id="release-note-h" className="text-base font-semibold">
        From the checker ({release.reviewer})
      </h2>
      {release.note && <p className="whitespace-pre-wrap text-sm">{release.note}</p>}
      {release.overrideReason && (
        <p className="rounded border-2 border-hazard p-2 text-sm">
          <span className="font-semibold text-hazard">Released despite a missed budget.</span> Reason:{" "}
          {release.overrideReason}
        </p>
      )}
    </section>
  );
}
