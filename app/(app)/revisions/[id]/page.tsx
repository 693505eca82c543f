// The revision page: what a revision froze (stage, plans), its pin maps and
// checklists rendered, every file highlighted, and the bundle with its sha256.
import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { BuildProgress } from "@/components/retrofit/build-progress";
import { EmulationProof } from "@/components/review/emulation-proof";
import { StateBadge } from "@/components/review/state-badge";
import { HazardCaution } from "@/components/ui/hazard-caution";
import { pageUser } from "@/lib/auth/page";
import { ANY, READ_ALL, REVIEW_VIEW } from "@/lib/auth/roles";
import { getRetrofitById } from "@/lib/retrofits/get";
import { getRevisionById, listRevisionFiles, listRevisionImages } from "@/lib/retrofits/revisions";
import { canReadRevision } from "@/lib/revisions/access";
import { progressList, type BuildProgress as Progress } from "@/lib/revisions/build-state";
import type { RevisionEmulations } from "@/lib/revisions/emulations";
import type { StoredPlan } from "@/lib/revisions/types";
import { FileView } from "./file-view";
import { Markdown } from "./markdown";
import { PlanSummary } from "./plan-summary";

export const metadata: Metadata = { title: "Revision" };

export default async function RevisionPage({ params }: { params: Promise<{ id: string }> }) {
  const { user } = await pageUser(ANY);
  const raw = (await params).id;
  if (!/^[1-9][0-9]{0,9}$/.test(raw)) notFound();
  const revision = await getRevisionById({ id: Number(raw) });
  const retrofit = revision ? await getRetrofitById({ id: revision.retrofitId }) : null;
  if (!revision || !retrofit) notFound();
  // Outside the read rule answers exactly like a missing revision: a
  // technician must not learn that another site's revision or a draft exists.
  if (!canReadRevision(user, revision, retrofit)) notFound();
  const files = await listRevisionFiles({ revisionId: revision.id });
  const images = await listRevisionImages({ revisionId: revision.id });
  const plans = revision.plans as StoredPlan[];
  const folders = [...new Set(files.filter((f) => f.path.includes("/")).map((f) => f.path.split("/")[0]))];
  const byPath = new Map(files.map((f) => [f.path, f]));
  const readAll = READ_ALL.includes(user.role);

  return (
    <div className="space-y-4">
      <header className="space-y-1">
        <p className="text-sm text-ink-soft">
          {readAll ? (
            <Link className="underline" href={`/retrofits/${retrofit.id}`}>
              {retrofit.name}
            </Link>
          ) : (
            retrofit.name
          )}{" "}
          · {retrofit.site} · <span className="num">{retrofit.assetTag}</span>
        </p>
        <h1 className="flex items-center gap-3 text-xl font-semibold">
          <span className="num">r{revision.number}</span>
          <StateBadge state={revision.state} superseded={revision.supersededAt !== null} />
        </h1>
        <p className="text-sm text-ink-soft">
          Engine {revision.engineVersion} · made{" "}
          {revision.createdAt.toISOString().slice(0, 16).replace("T", " ")} UTC
          {revision.note && <> · {revision.note}</>}
        </p>
      </header>

      {revision.buildState !== "ready" && (
        <BuildProgress
          initial={{
            id: revision.id,
            number: revision.number,
            buildState: revision.buildState,
            buildError: revision.buildError,
            targets: progressList(revision.buildProgress as Progress),
          }}
        />
      )}

      {revision.buildState === "ready" && (
        <section aria-labelledby="bundle-title" className="panel flex flex-wrap items-center gap-4">
          <h2 id="bundle-title" className="sr-only">
            Bundle
          </h2>
          <a className="btn-primary" href={`/api/v1/revisions/${revision.id}/bundle`} download>
            Download bundle (zip, {Math.ceil(revision.bundleSize / 1024)} KiB)
          </a>
          <p className="text-sm">
            sha256{" "}
            <code className="num break-all" data-testid="bundle-sha256">
              {revision.bundleSha256}
            </code>
          </p>
          {readAll && (
            <Link className="underline" href={`/retrofits/${retrofit.id}/compare?b=${revision.id}`}>
              Compare with another revision
            </Link>
          )}
          {REVIEW_VIEW.includes(user.role) && (
            <Link className="underline" href={`/revisions/${revision.id}/review`}>
              Review
            </Link>
          )}
        </section>
      )}

      {revision.buildState === "ready" && (
        <EmulationProof
          headingId="emulation-title"
          number={revision.number}
          folders={progressList(revision.buildProgress as Progress).map((p) => p.folder)}
          emulations={revision.emulations as RevisionEmulations}
          unprovenReason={revision.unprovenReason}
        />
      )}

      <HazardCaution mainsPowered={retrofit.mainsPowered} drivesThyristor={retrofit.drivesThyristor} />
      <PlanSummary plans={plans} />

      {folders.map((folder) => (
        <section key={folder} aria-labelledby={`dev-${folder}`} className="panel space-y-4">
          <h2 id={`dev-${folder}`} className="font-semibold">
            <span className="num">{folder}/</span>
          </h2>
          {["PINMAP.md", "CHECKLIST.md"].map((name) => {
            const f = byPath.get(`${folder}/${name}`);
            return f ? <Markdown key={name} source={f.content} /> : null;
          })}
        </section>
      ))}

      <section aria-labelledby="files-title" className="space-y-2">
        <h2 id="files-title" className="font-semibold">
          Files ({files.length})
        </h2>
        {files.map((f) => (
          <FileView key={f.path} path={f.path} content={f.content} sha256={f.sha256} />
        ))}
      </section>

      {images.length > 0 && (
        <section aria-labelledby="images-title" className="space-y-2">
          <h2 id="images-title" className="font-semibold">
            Ready-to-flash images ({images.length})
          </h2>
          <table className="w-full text-sm">
            <thead>
              <tr className="text-left">
                <th scope="col">File</th>
                <th scope="col">Bytes</th>
                <th scope="col">sha256</th>
              </tr>
            </thead>
            <tbody>
              {images.map((img) => (
                <tr key={img.path} data-testid="image-row">
                  <td>
                    <a
                      className="num underline"
                      href={`/api/v1/revisions/${revision.id}/files/${img.path.split("/").map(encodeURIComponent).join("/")}`}
                      download
                    >
                      {img.path}
                    </a>
                  </td>
                  <td className="num">{img.size}</td>
                  <td>
                    <code className="num break-all">{img.sha256}</code>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      )}
    </div>
  );
}
