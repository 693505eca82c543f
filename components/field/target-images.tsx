// The image files per target that the release covers, each with its sha256
// (compare it with `sha256sum firmware/<file>` before flashing), and whether
// the emulator ran that image and agreed with the plan.
import { verdictSentence, type RevisionEmulations } from "@/lib/revisions/emulations";

export function TargetImages({
  images,
  emulations,
  released,
}: {
  images: { path: string; size: number; sha256: string }[];
  emulations: RevisionEmulations;
  released: boolean;
}) {
  const folders = [...new Set(images.map((i) => i.path.split("/")[0]))];
  if (folders.length === 0) return null;
  return (
    <section aria-labelledby="target-images-h" className="panel space-y-3">
      <h2 id="target-images-h" className="font-semibold">
        {released ? "Images this release covers" : "Images of this revision"}
      </h2>
      {folders.map((folder) => {
        const e = emulations[folder];
        return (
          <div key={folder} className="space-y-1" data-testid="target-images">
            <h3 className="num text-sm font-semibold">{folder}/</h3>
            <ul className="space-y-1 text-sm">
              {images
                .filter((i) => i.path.startsWith(`${folder}/`))
                .map((i) => (
                  <li key={i.path} data-testid="image-sha">
                    <span className="num">{i.path.slice(folder.length + 1)}</span> sha256{" "}
                    <code className="num break-all">{i.sha256}</code>
                    {e?.image?.path === i.path && <> · run in the emulator</>}
                  </li>
                ))}
            </ul>
            <p className="text-xs text-ink-soft">{verdictSentence(e)}</p>
          </div>
        );
      })}
    </section>
  );
}
