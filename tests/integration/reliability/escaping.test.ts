// Script-like and path-like names stay inert where they are shown: escaped in
// the HTML of the pages, inside /* */ in generated C (the comment cannot be
// closed early; checked by compiling with avr-gcc) and as text in the
// bundle's Markdown (no raw HTML tag, no link or heading injected).
import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { retrofits, revisionFiles } from "@/db/schema";
import { requireTool } from "../../tools/require-tool";
import { makeRetrofit, makeRevision, makeWorld, type World } from "./world";

const NAME = `</title><script>alert("n")</script> */ int evil; /* ../../etc/passwd`;
const SITE = `<img src=x onerror=alert(1)> [link](javascript:alert(1))`;
const TAG = `*/ #define X 1 /*`;

let w: World;
let revId: number;
let files: { path: string; content: string }[];

beforeAll(async () => {
  w = await makeWorld();
  const rf = await makeRetrofit(w, w.author.id);
  await db
    .update(retrofits)
    .set({ name: NAME, description: `# Heading\n<b>bold</b>` })
    .where(eq(retrofits.id, rf.id));
  // The asset tag and site go through the generator too.
  await db.update(retrofits).set({ assetTag: TAG }).where(eq(retrofits.id, rf.id));
  await db
    .update(retrofits)
    .set({ site: `${w.site} ${SITE}` })
    .where(eq(retrofits.id, rf.id));
  const r = await makeRevision(rf.id, w.author.id, "prepared");
  revId = r.id;
  files = await db.select().from(revisionFiles).where(eq(revisionFiles.revisionId, revId));
  w.retrofitIds.push(rf.id);
});

describe("HTML pages", () => {
  it("show the names escaped", async () => {
    const rf = w.retrofitIds[w.retrofitIds.length - 1];
    let all = "";
    for (const path of [
      `/retrofits/${rf}`,
      `/revisions/${revId}`,
      `/retrofits?q=${encodeURIComponent("alert")}`,
    ]) {
      const html = await (await w.actors.engineer.session.fetch(path)).text();
      expect(html, path).not.toContain('<script>alert("n")</script>');
      expect(html, path).not.toContain("<img src=x onerror");
      all += html;
    }
    // The name is there, as text (&lt;) or inside the page data as \u003c.
    expect(all).toMatch(/&lt;script&gt;alert|\\u003cscript\\u003ealert/);
  });
});

describe("generated C", () => {
  it("keeps the names inside comments: every C file still compiles and defines no injected symbol", () => {
    requireTool("avr-gcc", "gcc-avr");
    const c = files.filter((f) => /\.(c|h)$/.test(f.path) && f.path.includes("atmega328p"));
    expect(c.length).toBeGreaterThan(0);
    const dir = mkdtempSync(join(tmpdir(), "cg-esc-"));
    for (const f of c) {
      // Outside comments and strings the injected text must not appear.
      const code = f.content.replace(/\/\*[\s\S]*?\*\//g, "").replace(/\/\/.*$/gm, "");
      expect(code, f.path).not.toMatch(/int evil|#define X 1/);
    }
    expect(c.map((f) => f.path)).toContain("atmega328p/src/main.c");
    {
      for (const f of c) {
        const p = join(dir, f.path.split("/").pop()!);
        writeFileSync(p, f.content);
      }
      execFileSync("avr-gcc", ["-mmcu=atmega328p", "-Os", "-fsyntax-only", "-I", dir, join(dir, "main.c")]);
    }
  });
});

describe("bundle Markdown", () => {
  it("carries no raw HTML tag and no injected heading or link from the names", () => {
    const md = files.filter((f) => f.path.endsWith(".md"));
    expect(md.length).toBeGreaterThan(0);
    for (const f of md) {
      // CommonMark: a backslash makes the next punctuation literal text.
      expect(f.content, f.path).not.toMatch(/(^|[^\\])<(script|img|\/title)/m);
      expect(f.content, f.path).not.toMatch(/(^|[^\\])\]\(javascript:/m);
      expect(f.content, f.path).toContain("\\<script\\>");
      expect(f.content, f.path).not.toMatch(/^# Heading$/m);
    }
  });
});
