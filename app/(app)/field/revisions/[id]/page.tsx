// One approved revision on site: download, check form, capture upload and the
// retrofit's field history. Laid out in one column for a phone.
import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { CapturePanel } from "@/components/capture/capture-panel";
import { CheckForm } from "@/components/field/check-form";
import { CopySha } from "@/components/field/copy-sha";
import { VerifyBundle } from "@/components/field/verify-bundle";
import { FieldHistory } from "@/components/field/field-history";
import { ReleaseNote } from "@/components/field/release-note";
import { TargetImages } from "@/components/field/target-images";
import { capturesKey } from "@/components/field/keys";
import { HazardCaution } from "@/components/ui/hazard-caution";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { CAPTURE, FIELD, FIELD_VIEW } from "@/lib/auth/roles";
import { targetFolders } from "@/lib/bundle/folders";
import { checklistSteps } from "@/lib/field/checklist-steps";
import { getRevisionFile, getRevisionWithRetrofit } from "@/lib/field/queries";
import { canReadRevision } from "@/lib/revisions/access";
import { listRevisionImages } from "@/lib/retrofits/revisions";
import { loadEmulations } from "@/lib/revisions/load-emulations";
import { deviceName } from "@/components/retrofit/format";

export const metadata: Metadata = { title: "Field check" };

export default async function FieldRevisionPage({ params }: { params: Promise<{ id: string }> }) {
  const { user, allowed } = await pageUser(FIELD_VIEW);
  if (!allowed) return <NotAllowed role={user.role} what="field work" />;
  const raw = (await params).id;
  const id = /^[1-9][0-9]{0,9}$/.test(raw) ? Number(raw) : NaN;
  const found = Number.isFinite(id) ? await getRevisionWithRetrofit({ id }) : null;
  if (!found || !canReadRevision(user, found.revision, found.retrofit)) notFound();
  const { revision, retrofit } = found;
  const devices = ((revision.spec as { targets?: { device: string }[] }).targets ?? []).map((t) => t.device);
  const released = revision.state === "released";
  const checklists = await Promise.all(
    targetFolders(devices).map(async (folder) =>
      checklistSteps(
        (await getRevisionFile({ revisionId: revision.id, path: `${folder}/CHECKLIST.md` })) ?? "",
      ),
    ),
  );
  const [images, emu] = await Promise.all([
    listRevisionImages({ revisionId: revision.id }),
    loadEmulations(revision.id),
  ]);

  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-col gap-2">
        <Link href="/field" className="text-sm underline">
          ← All bundles
        </Link>
        <h1 className="text-xl font-semibold">
          <span className="num">{retrofit.assetTag}</span> · {retrofit.name} ·{" "}
          <span className="num">r{revision.number}</span>
        </h1>
        <p className="text-sm text-ink-soft">
          {retrofit.site}
          {retrofit.boardRef ? ` · ${retrofit.boardRef}` : ""} · {devices.map(deviceName).join(", ")}
          {revision.supersededAt ? " · superseded by a newer released revision" : ""}
        </p>
        <CopySha sha256={revision.bundleSha256} />
        <div>
          <a className="btn-primary" href={`/api/v1/revisions/${revision.id}/bundle`} download>
            Download bundle
          </a>
        </div>
        <VerifyBundle sha256={revision.bundleSha256} label={`bundle r${revision.number}`} />
        <Link href={`/field/revisions/${revision.id}/print`} className="no-print w-fit text-sm underline">
          Print checklist and pin map
        </Link>
      </header>
      <HazardCaution mainsPowered={retrofit.mainsPowered} drivesThyristor={retrofit.drivesThyristor} />
      <ReleaseNote revisionId={revision.id} />
      <TargetImages images={images} emulations={emu?.emulations ?? {}} released={released} />
      {FIELD.includes(user.role) && released && (
        <section className="panel">
          <CheckForm
            revisionId={revision.id}
            retrofitId={retrofit.id}
            devices={devices}
            signer={user.name}
            checklists={checklists}
          />
        </section>
      )}
      {!released && (
        <p className="panel text-ink-soft">
          This revision is {revision.state.replace("_", " ")}; field checks are recorded against released
          revisions only.
        </p>
      )}
      {CAPTURE.includes(user.role) && (
        <section className="panel">
          <CapturePanel retrofitId={retrofit.id} listKey={capturesKey(retrofit.id)} />
        </section>
      )}
      <FieldHistory retrofitId={retrofit.id} />
    </div>
  );
}
