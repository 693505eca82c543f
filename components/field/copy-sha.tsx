"use client";
// Short form of a bundle's sha256 for reading aloud on site, the full value in
// the title and one click to copy it for comparison with `sha256sum`.
import { useState } from "react";

export function CopySha({ sha256 }: { sha256: string }) {
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
    <span className="inline-flex items-center gap-2">
      <code className="num text-xs" title={sha256} data-testid="bundle-sha">
        sha256 {sha256.slice(0, 12)}…
      </code>
      <button
        type="button"
        className="btn px-2 py-0.5 text-xs"
        onClick={copy}
        aria-label={`Copy sha256 ${sha256}`}
      >
        {copied === "yes" ? "Copied" : copied === "no" ? "Select and copy" : "Copy"}
      </button>
    </span>
  );
}
