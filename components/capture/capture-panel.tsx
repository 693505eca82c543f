"use client";
// Upload a capture and see what was measured, with the trace. Used on the
// field check page (linked to the retrofit) and on the capture page.
import { useState } from "react";
import { useSWRConfig } from "swr";
import type { CaptureView } from "@/lib/field/shapes";
import { MeasurementTable } from "./measurement-table";
import { LazyTracePlot as TracePlot } from "./lazy-trace-plot";
import { UploadForm } from "./upload-form";

export function CapturePanel({ retrofitId, listKey }: { retrofitId?: number; listKey?: string }) {
  const { mutate } = useSWRConfig();
  const [capture, setCapture] = useState<CaptureView | null>(null);
  return (
    <div className="flex flex-col gap-4">
      <UploadForm
        retrofitId={retrofitId}
        onUploaded={(c) => {
          setCapture(c);
          if (listKey) void mutate(listKey);
        }}
      />
      {capture && (
        <section
          aria-labelledby="capture-result"
          className="flex flex-col gap-3"
          data-testid="capture-result"
        >
          <h3 id="capture-result" className="font-semibold">
            Capture #{capture.id}: {capture.fileName}
          </h3>
          <p className="num text-xs text-ink-soft" title={capture.sha256}>
            sha256 {capture.sha256.slice(0, 16)}… · {(capture.byteSize / 1024).toFixed(1)} KiB
          </p>
          <MeasurementTable m={capture.measurement} />
          <TracePlot captureId={capture.id} />
        </section>
      )}
    </div>
  );
}
