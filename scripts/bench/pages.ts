// Pages part: first-load JavaScript per route of the production build, gzip
// size. A route loads the build's root main files plus the entry chunks of
// its layouts and page, as listed in the route's client reference manifest
// (Next 16: server/app/<route>_client-reference-manifest.js, entryJSFiles).
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { runInNewContext } from "node:vm";
import { gzipSync } from "node:zlib";
import { figure, type Figure } from "./figures";

const TARGET_KB = 200;

interface ClientManifest {
  entryJSFiles?: Record<string, string[]>;
}

/** The manifest file assigns globalThis.__RSC_MANIFEST[route]; run it in a sandbox and read that. */
export function readClientManifest(file: string): ClientManifest {
  const sandbox: { globalThis?: unknown; __RSC_MANIFEST?: Record<string, ClientManifest> } = {};
  sandbox.globalThis = sandbox;
  runInNewContext(readFileSync(file, "utf8"), sandbox, { timeout: 1000 });
  const entries = Object.values(sandbox.__RSC_MANIFEST ?? {});
  if (entries.length !== 1) throw new Error(`${file}: expected one route, found ${entries.length}`);
  return entries[0];
}

/** Chunks a route loads first: root main files, then every entry chunk of its segments, each once. */
export function routeChunks(rootMainFiles: readonly string[], manifest: ClientManifest): string[] {
  const all = [...rootMainFiles, ...Object.values(manifest.entryJSFiles ?? {}).flat()];
  return [...new Set(all.map((f) => f.replace(/^\/?_next\//, "")))];
}

export async function pagesPart(log: (s: string) => void) {
  const dist = process.env.NEXT_DIST_DIR ?? ".next-bench";
  const buildManifest = path.join(dist, "build-manifest.json");
  if (!existsSync(buildManifest))
    throw new Error(`no production build in ${dist} (run through scripts/bench.sh)`);
  const { rootMainFiles } = JSON.parse(readFileSync(buildManifest, "utf8")) as { rootMainFiles: string[] };
  const routes = JSON.parse(readFileSync(path.join(dist, "app-path-routes-manifest.json"), "utf8")) as Record<
    string,
    string
  >;
  const gz = new Map<string, number>();
  const gzipOf = (chunk: string) => {
    if (!gz.has(chunk)) gz.set(chunk, gzipSync(readFileSync(path.join(dist, chunk))).byteLength);
    return gz.get(chunk)!;
  };
  const perRoute: Record<string, { kb: number; chunks: string[] }> = {};
  for (const [entry, route] of Object.entries(routes)) {
    if (!entry.endsWith("/page") || route.startsWith("/_")) continue;
    const file = path.join(dist, "server", "app", `${entry}_client-reference-manifest.js`);
    if (!existsSync(file)) throw new Error(`${file} missing: has the Next build layout changed?`);
    const chunks = routeChunks(rootMainFiles, readClientManifest(file));
    const kb = chunks.reduce((s, c) => s + gzipOf(c), 0) / 1000;
    perRoute[route] = { kb, chunks };
  }
  const sorted = Object.entries(perRoute).sort((a, b) => b[1].kb - a[1].kb);
  if (sorted.length === 0) throw new Error(`no page routes in ${dist}`);
  log(`pages: ${sorted.map(([r, v]) => `${r} ${v.kb.toFixed(1)} kB`).join(", ")}`);
  const figures: Figure[] = sorted.map(([route, v]) =>
    figure(
      `pages: first-load JS ${route}`,
      v.kb,
      "kB",
      { op: "<=", value: TARGET_KB },
      `gzip, ${v.chunks.length} chunks`,
    ),
  );
  return { figures, details: { dist, perRoute } };
}
