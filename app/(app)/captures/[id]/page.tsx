// One capture: file facts, the measurement, the zoomable trace and, for
// engineers, turning it into the retrofit's measured stage; for its uploader
// or an admin, deleting it.
import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { DeleteCapture } from "@/components/capture/delete-capture";
import { MeasureAgain } from "@/components/capture/measure-again";
import { MeasurementTable } from "@/components/capture/measurement-table";
import { LazyTracePlot as TracePlot } from "@/components/capture/lazy-trace-plot";
import { UseAsStage } from "@/components/capture/use-as-stage";
import { CopySha } from "@/components/field/copy-sha";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { ANY, CAPTURE, EDIT } from "@/lib/auth/roles";
import { captureView, loadReadableCapture } from "@/lib/field/captures";
import { stageRetrofits } from "@/lib/field/stage-retrofits";

export const metadata: Metadata = { title: "Capture" };

export default async function CapturePage({ params }: { params: Promise<{ id: string }> }) {
  const { user, allowed } = await pageUser(ANY);
  if (!allowed) return <NotAllowed role={user.role} what="captures" />;
  const raw = (await params).id;
  if (!/^[1-9][0-9]{0,9}$/.test(raw)) notFound();
  const row = await loadReadableCapture({ id: Number(raw), user }).catch(() => null);
  if (!row) notFound();
  const c = captureView(row);
  const canEdit = EDIT.includes(user.role);
  // Technicians choose channel and probe on their own uploads (the route's rule).
  const canChoose = canEdit || (CAPTURE.includes(user.role) && c.uploadedBy.id === user.id);
  const choices = canEdit ? await stageRetrofits(c.retrofitId) : [];
  return (
    <div className="flex flex-col gap-4">
      <header>
        <Link href="/captures" className="text-sm underline">
          ← Captures
        </Link>
        <h1 className="break-words text-xl font-semibold">
          Capture #{c.id}: {c.fileName}
        </h1>
        <CopySha sha256={c.sha256} full />
        <p className="num break-words text-xs text-ink-soft">
          {(c.byteSize / 1024).toFixed(1)} KiB · {c.uploadedBy.name} ·{" "}
          {c.createdAt.slice(0, 16).replace("T", " ")} UTC
        </p>
      </header>
      <section className="panel">
        <MeasurementTable m={c.measurement} />
      </section>
      {canChoose && (
        <section className="panel">
          <MeasureAgain captureId={c.id} m={c.measurement} />
        </section>
      )}
      <section className="panel">
        {/* Keyed by the choice so a new measurement fetches its own trace. */}
        <TracePlot
          key={`${c.measurement.scaling?.voltageColumn ?? 0}-${c.measurement.scaling?.probe ?? 1}`}
          captureId={c.id}
        />
      </section>
      {canEdit && (
        <section className="panel">
          <UseAsStage captureId={c.id} retrofitId={c.retrofitId} choices={choices} />
        </section>
      )}
      {(user.role === "admin" || c.uploadedBy.id === user.id) && (
        <section className="panel">
          <DeleteCapture captureId={c.id} fileName={c.fileName} />
        </section>
      )}
    </div>
  );
}
