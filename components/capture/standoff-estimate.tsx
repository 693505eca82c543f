"use client";
// A UJT's standoff ratio from a ramp's trip voltage and the supply the user
// types: eta = (Vp - VD) / VBB (2N2646 data sheet, peak-point voltage), with
// the usual 0.6 V emitter diode drop (common practice, no source).
import { useId, useState } from "react";
import { standoffRatio } from "@/lib/capture/ramp";
import { formatEng, formatRatio, parseEng } from "@/lib/engine";

export function StandoffEstimate({ peakV }: { peakV: number }) {
  const id = useId();
  const [text, setText] = useState("");
  let supply: number | null = null;
  let problem: string | null = null;
  if (text.trim() !== "") {
    try {
      supply = parseEng(text, "V");
      if (!(supply > 0)) problem = "The supply is a positive voltage.";
      else if (supply <= peakV)
        problem = `The supply must be above the trip voltage (${formatEng(peakV, "V", 4)}).`;
    } catch (e) {
      problem = (e as Error).message;
    }
  }
  const eta = supply !== null && problem === null ? standoffRatio(peakV, supply) : null;
  return (
    <div className="flex flex-col gap-1 text-sm">
      <label className="field-label" htmlFor={id}>
        Supply across the UJT bases (V), to estimate its standoff ratio
      </label>
      <input
        id={id}
        className="input num max-w-[12rem]"
        inputMode="decimal"
        value={text}
        placeholder="e.g. 20"
        aria-describedby={`${id}-out`}
        onChange={(e) => setText(e.target.value)}
      />
      <p id={`${id}-out`} data-testid="standoff-ratio" role="status">
        {problem ??
          (eta !== null
            ? `read as ${formatEng(supply!, "V", 4)}: standoff ratio ≈ ${formatRatio(eta, 3)} (trip − 0.6 V diode drop) / supply`
            : "")}
      </p>
    </div>
  );
}
