// The revision's pin map and checklist for paper, per target: the print
// stylesheet (app/globals.css) drops the navigation and buttons, starts each
// sheet on a new page and keeps rows and headings with what follows them.
import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Markdown } from "@/app/(app)/revisions/[id]/markdown";
import { PrintButton } from "@/components/field/print-button";
import { deviceName } from "@/components/retrofit/format";
import { HazardCaution } from "@/components/ui/hazard-caution";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { FIELD_VIEW } from "@/lib/auth/roles";
import { targetFolders } from "@/lib/bundle/folders";
import { getRevisionFile, getRevisionWithRetrofit } from "@/lib/field/queries";
import { canReadRevision } from "@/lib/revisions/access";

export const metadata: Metadata = { title: "Checklist and pin map" };

/** Line breaks inside table cells print as a separator (the Markdown view shows text only). */
const cellBreaks = (md: string) => md.replace(/<br>/g, " · ");

export default async function PrintChecklistPage({ params }: { params: Promise<{ id: string }> }) {
  const { user, allowed } = await pageUser(FIELD_VIEW);
  if (!allowed) return <NotAllowed role={user.role} what="field work" />;
  const raw = (await params).id;
  const id = /^[1-9][0-9]{0,9}$/.test(raw) ? Number(raw) : NaN;
  const found = Number.isFinite(id) ? await getRevisionWithRetrofit({ id }) : null;
  if (!found || !canReadRevision(user, found.revision, found.retrofit)) notFound();
  const { revision, retrofit } = found;
  const devices = ((revision.spec as { targets?: { device: string }[] }).targets ?? []).map((t) => t.device);
  const folders = targetFolders(devices);
  const sheets = await Promise.all(
    folders.map(async (folder) => ({
      folder,
      pinmap: await getRevisionFile({ revisionId: revision.id, path: `${folder}/PINMAP.md` }),
      checklist: await getRevisionFile({ revisionId: revision.id, path: `${folder}/CHECKLIST.md` }),
    })),
  );
  const caution = (
    <HazardCaution mainsPowered={retrofit.mainsPowered} drivesThyristor={retrofit.drivesThyristor} />
  );

  return (
    <div className="flex flex-col gap-4" data-testid="print-view">
      <header className="flex flex-col gap-2">
        <Link href={`/field/revisions/${revision.id}`} className="no-print text-sm underline">
          ← Field check
        </Link>
        <h1 className="text-xl font-semibold">
          <span className="num">{retrofit.assetTag}</span> · {retrofit.name} ·{" "}
          <span className="num">r{revision.number}</span>: checklist and pin map
        </h1>
        <p className="break-words text-sm">
          {retrofit.site}
          {retrofit.boardRef ? ` · board ${retrofit.boardRef}` : ""} · {devices.map(deviceName).join(", ")}
        </p>
        <p className="num break-all text-xs">bundle sha256 {revision.bundleSha256}</p>
        <div>
          <PrintButton label="Print" />
        </div>
      </header>
      {sheets.map((s, i) => (
        <div key={s.folder} className="contents">
          <section
            className={`print-sheet flex flex-col gap-2 ${i > 0 ? "print-break" : ""}`}
            aria-labelledby={`pin-${s.folder}`}
            data-testid={`sheet-pinmap-${s.folder}`}
          >
            <h2 id={`pin-${s.folder}`} className="font-semibold">
              Target {i + 1}: {deviceName(devices[i])} — pin map
            </h2>
            {caution}
            {s.pinmap ? <Markdown source={cellBreaks(s.pinmap)} /> : <p>No pin map in this bundle.</p>}
          </section>
          <section
            className="print-sheet print-break flex flex-col gap-2"
            aria-labelledby={`list-${s.folder}`}
            data-testid={`sheet-checklist-${s.folder}`}
          >
            <h2 id={`list-${s.folder}`} className="font-semibold">
              Target {i + 1}: {deviceName(devices[i])} — checklist
            </h2>
            {caution}
            {s.checklist ? (
              <Markdown source={cellBreaks(s.checklist)} />
            ) : (
              <p>No checklist in this bundle.</p>
            )}
          </section>
        </div>
      ))}
    </div>
  );
}
