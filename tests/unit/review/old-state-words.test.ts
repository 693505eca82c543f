// No page, component, mail text, review message or audit action uses the
// review words the product used before its own (lib/review/words.ts); the
// only place they may appear is the alias list there, kept for one API
// release. Comments are left out of the scan: they are not shown to anyone.
// The rule is our own (issue 19); no outside source.
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { describe, expect, it } from "vitest";
import { DECISION_ALIASES, REVIEW_ACTIONS, STATE_ALIASES } from "@/lib/review/words";

const ROOT = join(__dirname, "../../..");
const SCANNED = ["app", "components", "lib/mail", "lib/review"];
const ALIAS_FILE = "lib/review/words.ts";

// Whole words only, so identifiers such as approvedAt do not count. "Draft"
// with a capital is also a type name in a form, so only quoted or JSX-text
// uses of it count.
const OLD_WORDS: RegExp[] = [
  /\bdraft\b/,
  /["'`>]\s*Draft\b/,
  /\bin[ _-]review\b/i,
  /\bapprov(?:e|ed|es|ing|al)\b/i,
  /\bchanges[ _-]requested\b/i,
  /\brequest(?:ed)?[ _-]changes\b/i,
];

/** Source text with // and block comments blanked, line numbers kept. */
function withoutComments(src: string): string {
  return src
    .replace(/\/\*[\s\S]*?\*\//g, (m) => m.replace(/[^\n]/g, " "))
    .replace(/(^|[^:"'`\\])\/\/.*$/gm, (m, lead: string) => lead);
}

/** Every old word in `src`, as "line: text". */
function oldWordHits(src: string): string[] {
  const hits: string[] = [];
  withoutComments(src)
    .split("\n")
    .forEach((line, i) => {
      if (OLD_WORDS.some((re) => re.test(line))) hits.push(`${i + 1}: ${line.trim()}`);
    });
  return hits;
}

function sourceFiles(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) out.push(...sourceFiles(p));
    else if (/\.(ts|tsx|hbs|txt)$/.test(name)) out.push(p);
  }
  return out;
}

describe("old review words", () => {
  it("are caught when planted (the scan can fail)", () => {
    // Planted faults, one per old word: each must be found.
    for (const planted of [
      "subject: `Revision approved: ${label}`",
      "<button>Request changes</button>",
      'message: "only a draft can be submitted"',
      '<p>"Draft"</p>',
      'heading="In review"',
      'action: "revision.approve"',
      "state: 'changes_requested'",
    ]) {
      expect(oldWordHits(planted), planted).toHaveLength(1);
    }
    // ...and the allowed uses are not.
    for (const fine of [
      "approvedAt: r.decidedAt",
      "interface Draft {",
      "useState<Draft>({",
      "// a comment may say approved",
      "/* or draft */ const x = 1;",
      'const url = "http://example.test"; // approved',
    ]) {
      expect(oldWordHits(fine), fine).toEqual([]);
    }
  });

  it("appear nowhere in pages, components, mails or review code outside the alias list", () => {
    const hits: string[] = [];
    for (const dir of SCANNED) {
      for (const file of sourceFiles(join(ROOT, dir))) {
        const rel = relative(ROOT, file);
        if (rel === ALIAS_FILE) continue;
        for (const h of oldWordHits(readFileSync(file, "utf8"))) hits.push(`${rel}:${h}`);
      }
    }
    expect(hits).toEqual([]);
  });

  it("are not audit actions, and each alias maps to one of our words", () => {
    for (const action of Object.values(REVIEW_ACTIONS)) expect(oldWordHits(`"${action}"`)).toEqual([]);
    // The alias keys themselves are the old words; they must all be recognised as such.
    for (const old of [...Object.keys(STATE_ALIASES), ...Object.keys(DECISION_ALIASES)]) {
      expect(oldWordHits(`"${old}"`), old).toHaveLength(1);
    }
  });
});
