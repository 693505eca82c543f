// What app/ actually serves: every route.ts with its exported HTTP methods and
// every page.tsx, as URL patterns (route groups like "(app)" removed).
import { readdirSync, readFileSync } from "node:fs";
import { join, relative, sep } from "node:path";
import type { Method } from "./routes";

const APP = join(process.cwd(), "app");
const METHODS: Method[] = ["GET", "POST", "PATCH", "PUT", "DELETE"];

function walk(dir: string, name: string, out: string[] = []): string[] {
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, e.name);
    if (e.isDirectory()) walk(p, name, out);
    else if (e.name === name) out.push(p);
  }
  return out;
}

function patternOf(file: string): string {
  const parts = relative(APP, file)
    .split(sep)
    .slice(0, -1)
    .filter((s) => !/^\(.*\)$/.test(s));
  return "/" + parts.join("/");
}

/** Exported HTTP methods: `export const GET`, `export async function POST`, `export { h as GET }`. */
export function exportedMethods(source: string): Method[] {
  const found = new Set<Method>();
  for (const m of METHODS) {
    if (new RegExp(`export\\s+(const|let|async\\s+function|function)\\s+${m}\\b`).test(source)) found.add(m);
    for (const block of source.matchAll(/export\s*\{([^}]*)\}/g)) {
      if (new RegExp(`(^|[\\s,])(\\w+\\s+as\\s+)?${m}([\\s,]|$)`).test(block[1])) found.add(m);
    }
  }
  return [...found];
}

export function appRoutes(): { pattern: string; method: Method; file: string }[] {
  return walk(APP, "route.ts").flatMap((file) =>
    exportedMethods(readFileSync(file, "utf8")).map((method) => ({ pattern: patternOf(file), method, file })),
  );
}

export function appPages(): { pattern: string; file: string }[] {
  return walk(APP, "page.tsx").map((file) => ({ pattern: patternOf(file), file }));
}
