"use client";
// Short form of a bundle's sha256 for reading aloud on site, the full value in
// the title and one click to copy it for comparison with `sha256sum`. With
// `full` the whole value is shown and wraps anywhere (no sideways scroll).
import { useState } from "react";

export function CopySha({ sha256, full = false }: { sha256: string; full?: boolean }) {
  const [copied, setCopied] = useState<"yes" | "no" | null>(null);
  async function copy() {
    try {
      await navigator.clipboard.writeText(sha256);
      setCopied("yes");
    } catch {
      setCopied("no");
    }
    setTimeout(() => setCopied(null), 2000);
  }
  return (
    <span className={full ? "flex min-w-0 items-start gap-2" : "inline-flex items-center gap-2"}>
      <code
        className={`num text-xs ${full ? "min-w-0 break-all" : ""}`}
        title={sha256}
        data-testid={full ? "full-sha" : "bundle-sha"}
      >
        sha256 {full ? sha256 : `${sha256.slice(0, 12)}…`}
      </code>
      <button
        type="button"
        className="btn shrink-0 px-2 py-0.5 text-xs"
        onClick={copy}
        aria-label={`Copy sha256 ${sha256}`}
      >
        {copied === "yes" ? "Copied" : copied === "no" ? "Select and copy" : "Copy"}
      </button>
    </span>
  );
}
