"use client";
// Opens the browser's print dialog; hidden on paper with every other button.
export function PrintButton({ label }: { label: string }) {
  return (
    <button type="button" className="btn-primary" onClick={() => window.print()}>
      {label}
    </button>
  );
}
