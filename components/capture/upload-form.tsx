"use client";
// Capture upload with a progress bar. XMLHttpRequest, because fetch reports no
// upload progress; the server measures while the bytes arrive.
import { useRef, useState } from "react";
import type { CaptureView } from "@/lib/field/shapes";
import { ChannelProbeFields } from "./channel-probe-fields";

type Props = { retrofitId?: number; onUploaded: (capture: CaptureView) => void };

export function UploadForm({ retrofitId, onUploaded }: Props) {
  const input = useRef<HTMLInputElement>(null);
  const [progress, setProgress] = useState<number | null>(null);
  const [phase, setPhase] = useState<"idle" | "sending" | "measuring">("idle");
  const [error, setError] = useState<string | null>(null);
  const [channel, setChannel] = useState("1");
  const [probe, setProbe] = useState("1");

  function submit(e: React.FormEvent) {
    e.preventDefault();
    const file = input.current?.files?.[0];
    if (!file) {
      setError("Choose a CSV or TSV export from the oscilloscope first.");
      return;
    }
    setError(null);
    setPhase("sending");
    setProgress(0);
    const form = new FormData();
    form.append("file", file, file.name);
    const xhr = new XMLHttpRequest();
    const query = new URLSearchParams({ channel, probe });
    if (retrofitId) query.set("retrofitId", String(retrofitId));
    xhr.open("POST", `/api/v1/captures?${query.toString()}`);
    xhr.setRequestHeader("accept", "application/json");
    xhr.upload.onprogress = (ev) => {
      if (ev.lengthComputable) setProgress(ev.loaded / ev.total);
    };
    xhr.upload.onload = () => setPhase("measuring");
    xhr.onerror = () => {
      setPhase("idle");
      setError("The upload did not reach the server. Check the connection and try again.");
    };
    xhr.onload = () => {
      setPhase("idle");
      let body: { capture?: CaptureView; error?: { message?: string } } = {};
      try {
        body = JSON.parse(xhr.responseText) as typeof body;
      } catch {
        /* handled below */
      }
      if (xhr.status === 201 && body.capture) {
        if (input.current) input.current.value = "";
        onUploaded(body.capture);
      } else {
        setError(body.error?.message ?? `The server answered ${xhr.status}. Try again in a moment.`);
      }
    };
    xhr.send(form);
  }

  const busy = phase !== "idle";
  return (
    <form onSubmit={submit} className="flex flex-col gap-2" aria-labelledby="upload-title">
      <h2 id="upload-title" className="text-lg font-semibold">
        Upload a scope capture
      </h2>
      <div>
        <label className="field-label" htmlFor="capture-file">
          CSV or TSV export (time and voltage columns, or a sample interval in the header)
        </label>
        <input
          id="capture-file"
          ref={input}
          type="file"
          accept=".csv,.tsv,.txt,text/csv,text/plain"
          className="input"
          disabled={busy}
        />
      </div>
      <ChannelProbeFields
        idPrefix="upload"
        channel={channel}
        probe={probe}
        channels={null}
        disabled={busy}
        onChannel={setChannel}
        onProbe={setProbe}
      />
      <div className="flex flex-wrap items-center gap-3">
        <button type="submit" className="btn-primary" disabled={busy}>
          {phase === "sending" ? "Uploading…" : phase === "measuring" ? "Measuring…" : "Upload and measure"}
        </button>
        {busy && progress !== null && (
          <progress
            className="w-40"
            max={1}
            value={phase === "measuring" ? undefined : progress}
            aria-label="Upload progress"
          >
            {Math.round(progress * 100)} %
          </progress>
        )}
        {phase === "sending" && progress !== null && (
          <span className="num text-sm">{Math.round(progress * 100)} %</span>
        )}
      </div>
      {error && (
        <p role="alert" className="field-error">
          {error}
        </p>
      )}
    </form>
  );
}
