"use client";
// Drop or pick the downloaded zip and see at once whether it is byte for byte
// the bundle the reviewer approved. The file is hashed in this browser (Web
// Crypto) and never uploaded.
import { useId, useState } from "react";
import { compareSha, sha256Hex, type ShaVerdict } from "@/lib/field/sha-verify";

type State =
  | { kind: "idle" }
  | { kind: "hashing"; name: string }
  | { kind: "error"; message: string }
  | (ShaVerdict & { name: string });

export function VerifyBundle({ sha256, label }: { sha256: string; label: string }) {
  const inputId = useId();
  const [state, setState] = useState<State>({ kind: "idle" });
  const [over, setOver] = useState(false);

  async function check(file: File | undefined) {
    if (!file) return;
    setState({ kind: "hashing", name: file.name });
    try {
      const actual = await sha256Hex(await file.arrayBuffer());
      setState({ ...compareSha(sha256, actual), name: file.name });
    } catch (e) {
      setState({ kind: "error", message: e instanceof Error ? e.message : "The file could not be read." });
    }
  }

  return (
    <div
      className={`rounded border border-dashed p-2 text-sm ${over ? "border-accent bg-accent-soft" : "border-paper-line"}`}
      onDragOver={(e) => {
        e.preventDefault();
        setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={(e) => {
        e.preventDefault();
        setOver(false);
        void check(e.dataTransfer.files[0]);
      }}
      data-testid="verify-bundle"
    >
      <label htmlFor={inputId} className="block font-medium text-ink-soft">
        Check a downloaded {label}: drop the zip here or pick it
      </label>
      <input
        id={inputId}
        type="file"
        accept=".zip,application/zip"
        className="mt-1 block w-full max-w-full text-sm"
        onChange={(e) => void check(e.target.files?.[0])}
      />
      <p role="status" aria-live="polite" className="mt-1 break-all" data-testid="verify-result">
        {state.kind === "hashing" && <>Hashing {state.name}…</>}
        {state.kind === "match" && (
          <span className="font-medium text-ok">
            ✓ {state.name} matches the released bundle (sha256 <span className="num">{state.actual}</span>).
          </span>
        )}
        {state.kind === "mismatch" && (
          <span className="font-medium text-hazard">
            ✗ {state.name} does not match the released bundle: it has sha256{" "}
            <span className="num">{state.actual}</span>, the released bundle has{" "}
            <span className="num">{state.expected}</span>. Do not flash it; download the bundle again.
          </span>
        )}
        {(state.kind === "error" || state.kind === "bad-expected") && (
          <span className="font-medium text-hazard">{state.message}</span>
        )}
      </p>
    </div>
  );
}
