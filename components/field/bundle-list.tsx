// Released bundles by site, then asset: one card per retrofit so the list
// reads top to bottom on a phone. Superseded revisions stay listed, marked, so
// a technician can tell which firmware an older board carries.
import Link from "next/link";
import type { FieldAsset, FieldBundle } from "@/lib/field/shapes";
import { CopySha } from "./copy-sha";
import { VerifyBundle } from "./verify-bundle";
import { deviceName } from "@/components/retrofit/format";

function bySite(assets: FieldAsset[]): [string, FieldAsset[]][] {
  const m = new Map<string, FieldAsset[]>();
  for (const a of assets) m.set(a.site, [...(m.get(a.site) ?? []), a]);
  return [...m];
}

function kib(n: number): string {
  return `${(n / 1024).toFixed(1)} KiB`;
}

function BundleRow({ b, asset }: { b: FieldBundle; asset: FieldAsset }) {
  const current = b.supersededAt === null;
  return (
    <li
      className={`flex flex-col gap-2 py-3 ${current ? "" : "opacity-80"}`}
      data-testid={`bundle-r${b.number}`}
    >
      <div className="flex flex-wrap items-center gap-2">
        <span className="num font-semibold">r{b.number}</span>
        {current ? (
          <span className="rounded bg-ok-soft px-1.5 py-0.5 text-xs font-medium text-ok">current</span>
        ) : (
          <span className="rounded bg-paper-sunk px-1.5 py-0.5 text-xs font-medium text-ink-soft">
            superseded {b.supersededAt?.slice(0, 10)}
          </span>
        )}
        <span className="text-sm text-ink-soft">{b.devices.map(deviceName).join(", ")}</span>
      </div>
      <CopySha sha256={b.sha256} />
      <VerifyBundle sha256={b.sha256} label={`bundle r${b.number}`} />
      <div className="flex flex-wrap gap-2">
        <a
          className={current ? "btn-primary" : "btn"}
          href={`/api/v1/revisions/${b.revisionId}/bundle`}
          download
        >
          {/* The accessible name starts with the visible words (WCAG 2.5.3) and adds which bundle. */}
          Download bundle{" "}
          <span className="sr-only">
            r{b.number} of {asset.assetTag}
          </span>{" "}
          <span className="num text-xs">({kib(b.byteSize)})</span>
        </a>
        <Link className="btn" href={`/field/revisions/${b.revisionId}`}>
          Record check{" "}
          <span className="sr-only">
            of r{b.number} of {asset.assetTag}
          </span>
        </Link>
      </div>
    </li>
  );
}

export function BundleList({ assets }: { assets: FieldAsset[] }) {
  if (assets.length === 0) {
    return (
      <p className="panel text-ink-soft">
        No released bundles yet. Bundles appear here once a checker releases a revision for your site.
      </p>
    );
  }
  return (
    <div className="flex flex-col gap-6">
      {bySite(assets).map(([site, list]) => (
        <section key={site} aria-labelledby={`site-${site}`}>
          <h2 id={`site-${site}`} className="mb-2 text-lg font-semibold">
            {site}
          </h2>
          <ul className="grid gap-3 md:grid-cols-2">
            {list.map((a) => (
              <li key={a.retrofitId} className="panel" data-testid={`asset-${a.assetTag}`}>
                <div className="flex flex-wrap items-baseline justify-between gap-2">
                  <h3 className="font-semibold">
                    <span className="num">{a.assetTag}</span> · {a.name}
                  </h3>
                  <Link className="text-sm underline" href={`/field/retrofits/${a.retrofitId}`}>
                    Field history
                  </Link>
                </div>
                {a.boardRef && <p className="text-sm text-ink-soft">{a.boardRef}</p>}
                {(a.mainsPowered || a.drivesThyristor) && (
                  <p className="mt-1 text-sm font-medium text-hazard">
                    ⚠{" "}
                    {[a.mainsPowered && "mains-powered", a.drivesThyristor && "fires a thyristor"]
                      .filter(Boolean)
                      .join(", ")}
                    : isolate before work
                  </p>
                )}
                <ul className="divide-y divide-paper-line">
                  {a.bundles.map((b) => (
                    <BundleRow key={b.revisionId} b={b} asset={a} />
                  ))}
                </ul>
              </li>
            ))}
          </ul>
        </section>
      ))}
    </div>
  );
}
