// scripts/backup.sh (pg_dump custom format) of the test database, then
// scripts/restore.sh into a fresh database: every revision, its files and its
// bundle bytes come back byte for byte, and restore refuses to overwrite.
import { execFileSync, spawnSync } from "node:child_process";
import { createHash, randomBytes } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Pool } from "pg";
import { afterAll, describe, expect, it } from "vitest";
import { makeRetrofit, makeRevision, makeWorld } from "./world";

const source = new URL(process.env.DATABASE_URL ?? "postgres://postgres@127.0.0.1:54329/clockgraft_test");
const sourceDb = source.pathname.slice(1);
const restoredDb = `clockgraft_restore_${randomBytes(4).toString("hex")}`;
const dir = mkdtempSync(join(tmpdir(), "cg-backup-"));
const pools: Pool[] = [];

function poolFor(db: string) {
  const u = new URL(source);
  u.pathname = `/${db}`;
  const p = new Pool({ connectionString: u.toString(), max: 2 });
  pools.push(p);
  return p;
}

afterAll(async () => {
  await Promise.all(pools.map((p) => p.end()));
  const pgbin = execFileSync("bash", ["scripts/pg.sh", "bin"]).toString().trim();
  spawnSync(`${pgbin}/dropdb`, [
    "-h",
    source.hostname,
    "-p",
    source.port,
    "-U",
    "postgres",
    "--if-exists",
    restoredDb,
  ]);
  rmSync(dir, { recursive: true, force: true });
});

const REVISIONS_SQL = `select r.id, r.number, r.build_state, r.bundle, r.bundle_sha256, r.spec::text as spec,
  (select json_agg(json_build_object('path', f.path, 'content', f.content, 'sha256', f.sha256) order by f.path)
     from revision_files f where f.revision_id = r.id)::text as files
  from revisions r order by r.id`;

describe("backup and restore", () => {
  it("reproduces every revision, file and bundle byte for byte", { timeout: 300_000 }, async () => {
    // Make sure there is something of our own in it, in more than one state.
    const w = await makeWorld();
    const rf = await makeRetrofit(w, w.author.id);
    await makeRevision(rf.id, w.author.id, "released");

    const file = join(dir, "test.dump");
    execFileSync("bash", ["scripts/backup.sh", file, sourceDb], { stdio: "pipe" });
    execFileSync("bash", ["scripts/restore.sh", file, restoredDb], { stdio: "pipe" });

    // Revisions written after the dump are not in it: compare the ids it has. States
    // may move on meanwhile (other test files run in parallel); contents may not.
    // A revision a worker was still building at the dump gets its files and bundle
    // later (one transaction at the end of the job): only revisions built when the
    // dump was taken must match.
    const all = (await poolFor(restoredDb).query(REVISIONS_SQL)).rows;
    expect(all.map((r) => r.id)).toContain(w.revision.released);
    expect(all.map((r) => r.id)).toContain(w.revision.prepared);
    const restored = all.filter((r) => r.build_state !== "building");
    const ids = restored.map((r) => r.id);
    expect(ids).toContain(w.revision.released);
    expect(restored.filter((r) => r.build_state === "ready").length).toBeGreaterThan(0);
    const original = (await poolFor(sourceDb).query(REVISIONS_SQL)).rows.filter((r) => ids.includes(r.id));
    expect(restored.length).toBe(original.length);
    for (let i = 0; i < restored.length; i++) {
      const a = original[i];
      const b = restored[i];
      expect(Buffer.compare(a.bundle, b.bundle), `revision ${a.id} bundle`).toBe(0);
      // The stored checksum still matches the restored bytes (sha256, FIPS 180-4); a
      // failed build stores no bundle and no checksum.
      if (b.build_state === "ready")
        expect(createHash("sha256").update(b.bundle).digest("hex")).toBe(b.bundle_sha256);
      else expect([b.bundle.length, b.bundle_sha256]).toEqual([0, ""]);
      expect({ ...b, bundle: null }).toEqual({ ...a, bundle: null });
    }
  });

  it("refuses to restore over a database that exists", () => {
    const file = join(dir, "test.dump");
    const r = spawnSync("bash", ["scripts/restore.sh", file, restoredDb]);
    expect(r.status).toBe(3);
    expect(r.stderr.toString()).toMatch(/exists/);
  });
});
