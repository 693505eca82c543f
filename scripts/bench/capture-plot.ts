// Capture-plot part: zoomed plot windows of a large capture, answered the old
// way (the stored file parsed again per window) and from the stored levels
// (lib/field/capture-levels.ts), each in a child process of its own for its
// peak RSS. Needs DATABASE_URL (a migrated database with at least one user);
// the bench capture row is deleted afterwards.
//   npx tsx scripts/bench/main.ts --only=capture-plot
import { execFileSync } from "node:child_process";
import { createReadStream, existsSync, readFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { asc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { captures, users } from "@/db/schema";
import { parseCapture } from "@/lib/capture";
import { buildLevels, levelBytes, storeLevels } from "@/lib/field/capture-levels";
import { writeCapture } from "./capture";
import { figure } from "./figures";
import { median } from "./stats";

const SAMPLES = 2_000_000;
const FILE = path.join(os.tmpdir(), "clockgraft-bench", `capture-${SAMPLES}-v1.csv`);

type Child = { msPerWindow: number[]; baseRssKb: number; maxRssKb: number };

function child(how: "reparse" | "levels", arg: string): Child {
  const stdout = execFileSync(
    process.execPath,
    ["--import", "tsx", "scripts/bench/capture-plot-child.ts", how, arg],
    { encoding: "utf8", timeout: 600_000, env: process.env },
  );
  return JSON.parse(stdout.trim().split("\n").pop()!) as Child;
}

export async function capturePlotPart(log: (s: string) => void) {
  if (!process.env.DATABASE_URL) throw new Error("capture-plot needs DATABASE_URL");
  if (!existsSync(FILE)) await writeCapture(FILE, SAMPLES);
  const fileMb = readFileSync(FILE).length / 1e6;
  const [user] = await db.select({ id: users.id }).from(users).orderBy(asc(users.id)).limit(1);
  if (!user) throw new Error("capture-plot needs one user in the database");

  const t0 = performance.now();
  const trace = await parseCapture(createReadStream(FILE, { highWaterMark: 1 << 16 }), {
    maxBytes: 256 * 1024 * 1024,
  });
  const parseMs = performance.now() - t0;
  const [row] = await db
    .insert(captures)
    .values({
      retrofitId: null,
      uploadedBy: user.id,
      fileName: "bench-levels.csv",
      byteSize: 0,
      sha256: "bench",
      content: Buffer.from("bench"),
      measurement: {},
    })
    .returning({ id: captures.id });
  try {
    const t1 = performance.now();
    const rows = buildLevels(row.id, trace.t, trace.v);
    await db.transaction((tx) => storeLevels(tx, rows));
    const storeMs = performance.now() - t1;
    const stored = (await levelBytes(row.id)) / 1e6;
    log(
      `capture-plot: ${SAMPLES} samples, ${fileMb.toFixed(1)} MB CSV, levels ${stored.toFixed(1)} MB in ${rows.length} blocks`,
    );

    const before = child("reparse", FILE);
    const after = child("levels", String(row.id));
    log(`  re-parse per window ms: ${before.msPerWindow.map((x) => x.toFixed(0)).join(" ")}`);
    log(`  levels per window ms:   ${after.msPerWindow.map((x) => x.toFixed(1)).join(" ")}`);
    const rssMb = (c: Child) => (c.maxRssKb * 1024) / 1e6;
    const growMb = (c: Child) => ((c.maxRssKb - c.baseRssKb) * 1024) / 1e6;
    const note = `${SAMPLES / 1e6}M samples, ${fileMb.toFixed(0)} MB CSV, median of ${after.msPerWindow.length} windows`;
    return {
      figures: [
        figure("capture plot window, before (re-parse)", median(before.msPerWindow), "ms", undefined, note),
        figure(
          "capture plot window, stored levels",
          median(after.msPerWindow),
          "ms",
          { op: "<", value: 100 },
          note,
        ),
        figure(
          "capture plot, before: RSS growth",
          growMb(before),
          "MB",
          undefined,
          `peak ${rssMb(before).toFixed(0)} MB`,
        ),
        figure(
          "capture plot, levels: RSS growth",
          growMb(after),
          "MB",
          { op: "<", value: 50 },
          `peak ${rssMb(after).toFixed(0)} MB`,
        ),
        figure(
          "capture levels: build and store at upload",
          storeMs,
          "ms",
          undefined,
          `after a ${parseMs.toFixed(0)} ms parse; ${stored.toFixed(0)} MB stored`,
        ),
      ],
      details: { file: FILE, before, after, parseMs, storeMs, storedMb: stored, blocks: rows.length },
    };
  } finally {
    await db.delete(captures).where(eq(captures.id, row.id));
  }
}
