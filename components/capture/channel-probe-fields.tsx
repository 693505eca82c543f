"use client";
// Channel and probe attenuation selects, for the upload form (channels not
// known yet: 1 to 4) and the capture page (the file's voltage columns).
import { PROBE_CHOICES } from "@/lib/capture/choice";

type Props = {
  idPrefix: string;
  channel: string;
  probe: string;
  /** The file's voltage column names, or null before upload. */
  channels: string[] | null;
  disabled?: boolean;
  onChannel: (v: string) => void;
  onProbe: (v: string) => void;
};

const BEFORE_UPLOAD = ["1", "2", "3", "4"];

export function ChannelProbeFields({
  idPrefix,
  channel,
  probe,
  channels,
  disabled,
  onChannel,
  onProbe,
}: Props) {
  const options = channels
    ? channels.map((name, i) => ({ value: String(i + 1), label: `${i + 1}: ${name}` }))
    : BEFORE_UPLOAD.map((n) => ({ value: n, label: n === "1" ? "1 (first voltage column)" : n }));
  return (
    <div className="flex flex-wrap gap-3">
      <div className="min-w-0 max-w-full">
        <label className="field-label" htmlFor={`${idPrefix}-channel`}>
          Channel
        </label>
        <select
          id={`${idPrefix}-channel`}
          className="input w-auto max-w-full"
          value={channel}
          disabled={disabled}
          onChange={(e) => onChannel(e.target.value)}
        >
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      </div>
      <div className="min-w-0 max-w-full">
        <label className="field-label" htmlFor={`${idPrefix}-probe`}>
          Probe factor not applied by the scope
        </label>
        <select
          id={`${idPrefix}-probe`}
          className="input w-auto max-w-full"
          value={probe}
          disabled={disabled}
          onChange={(e) => onProbe(e.target.value)}
        >
          {PROBE_CHOICES.map((p) => (
            <option key={p} value={String(p)}>
              {p === 1 ? "1x (values as recorded)" : `${p}x (multiply by ${p})`}
            </option>
          ))}
        </select>
      </div>
    </div>
  );
}
