"use client";
// On the capture page: measure the stored file again with another channel or
// probe factor. The page reloads its data once the server has stored it.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { choiceOf } from "@/lib/capture/choice";
import { fetchJson } from "@/lib/client/fetch-json";
import type { MeasurementSummary } from "@/lib/field/shapes";
import { ChannelProbeFields } from "./channel-probe-fields";

export function MeasureAgain({ captureId, m }: { captureId: number; m: MeasurementSummary }) {
  const router = useRouter();
  const now = choiceOf(m);
  const [channel, setChannel] = useState(String(now.channel));
  const [probe, setProbe] = useState(String(now.probe));
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const names = m.columns.filter((c) => c.role === "voltage").map((c) => c.name);
  const unchanged = channel === String(now.channel) && probe === String(now.probe);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setError(null);
    setDone(null);
    try {
      await fetchJson(`/api/v1/captures/${captureId}/measurement`, {
        method: "POST",
        body: JSON.stringify({ channel: Number(channel), probe: Number(probe) }),
      });
      setDone(`Measured again: channel ${channel}, probe factor ${probe}x.`);
      router.refresh();
    } catch (err) {
      setError((err as Error).message);
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-2" aria-labelledby="measure-again-title">
      <h2 id="measure-again-title" className="text-lg font-semibold">
        Channel and probe
      </h2>
      <ChannelProbeFields
        idPrefix="again"
        channel={channel}
        probe={probe}
        channels={names.length > 0 ? names : null}
        disabled={busy}
        onChannel={setChannel}
        onProbe={setProbe}
      />
      <div>
        <button className="btn" type="submit" disabled={busy || unchanged}>
          {busy ? "Measuring…" : "Measure again"}
        </button>
      </div>
      {error && (
        <p role="alert" className="field-error">
          {error}
        </p>
      )}
      {done && (
        <p role="status" className="text-sm">
          {done}
        </p>
      )}
    </form>
  );
}
