import type { RevisionChoice } from "@/lib/diff/load";
import { STATE_WORDS } from "@/lib/review/words";

const label = (r: RevisionChoice) =>
  `r${r.number} · ${STATE_WORDS[r.state as keyof typeof STATE_WORDS] ?? r.state}${r.supersededAt ? " (superseded)" : ""}`;

/** Plain GET form: works without JavaScript and keeps the pair in the URL. */
export function RevisionPicker({ choices, a, b }: { choices: RevisionChoice[]; a: number; b: number }) {
  return (
    <form method="get" className="flex flex-wrap items-end gap-3" aria-label="Choose revisions">
      <div>
        <label htmlFor="pick-a" className="field-label">
          Older (before)
        </label>
        <select id="pick-a" name="a" defaultValue={a} className="input w-56">
          <option value={0}>nothing (all files new)</option>
          {choices.map((r) => (
            <option key={r.id} value={r.id}>
              {label(r)}
            </option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor="pick-b" className="field-label">
          Newer (after)
        </label>
        <select id="pick-b" name="b" defaultValue={b} className="input w-56">
          {choices.map((r) => (
            <option key={r.id} value={r.id}>
              {label(r)}
            </option>
          ))}
        </select>
      </div>
      <button type="submit" className="btn">
        Compare
      </button>
    </form>
  );
}
