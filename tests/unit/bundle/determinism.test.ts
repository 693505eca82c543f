// Bundle contract (engine.md section 5, product.md bundle layout): same spec
// -> byte-identical files and zip; layout, plan.json, checksums, cautions,
// sanitised user text, typed error for an unplannable target.
import { describe, expect, it, vi } from "vitest";
import { buildBundleSources, cautionLines, sha256Hex, textOf, zipBundle } from "@/lib/bundle";
import { EngineError } from "@/lib/engine";
import { FOLDERS, TARGETS, spec } from "./fixtures";

describe("bundle determinism and layout", () => {
  it("two builds give the same files and the same zip sha256, an hour apart on the clock", async () => {
    // fake timers move the wall clock instead of sleeping (a real sleep only slows the suite)
    vi.useFakeTimers({ toFake: ["Date"] });
    try {
      vi.setSystemTime(new Date("2026-03-01T08:00:00Z"));
      const a = buildBundleSources(spec());
      const za = await zipBundle(a);
      vi.setSystemTime(new Date("2026-03-01T09:00:01Z"));
      const b = buildBundleSources(spec());
      const zb = await zipBundle(b);
      expect(b).toEqual(a);
      expect(sha256Hex(zb)).toBe(sha256Hex(za));
    } finally {
      vi.useRealTimers();
    }
  });

  it("paths follow the product layout, sorted, one folder per target with -2, -3 for repeats", () => {
    const files = buildBundleSources(spec());
    const paths = files.map((f) => f.path);
    expect(paths).toEqual([...paths].sort());
    expect(paths).toContain("README.md");
    expect(paths).toContain("plan.json");
    for (const folder of FOLDERS) {
      for (const p of ["src/main.c", "src/timing.h", "Makefile", "PINMAP.md", "pinmap.csv", "CHECKLIST.md"]) {
        expect(paths).toContain(`${folder}/${p}`);
      }
    }
    expect(paths).toContain("stm32g031/src/startup.c");
    expect(paths).toContain("rp2040-2/src/device.ld");
  });

  it("README lists the sha256 of every other file and the engine version", () => {
    const files = buildBundleSources(spec());
    const readme = files.find((f) => f.path === "README.md")!.content;
    for (const f of files.filter((x) => x.path !== "README.md")) {
      expect(readme).toContain(`${sha256Hex(f.content)}  ${f.path}`);
    }
    expect(readme).toMatch(/Engine version \| \d+\.\d+\.\d+/);
  });

  it("plan.json has keys sorted at every depth and exact numbers", () => {
    const files = buildBundleSources(spec());
    const json = JSON.parse(textOf(files.find((f) => f.path === "plan.json")!));
    const check = (v: unknown): void => {
      if (Array.isArray(v)) return v.forEach(check);
      if (v && typeof v === "object") {
        const keys = Object.keys(v);
        expect(keys).toEqual([...keys].sort());
        keys.forEach((k) => check((v as Record<string, unknown>)[k]));
      }
    };
    check(json);
    expect(json.targets[0].plan.periodS).toBe(0.02);
    expect(json.targets.map((t: { folder: string }) => t.folder)).toEqual(FOLDERS);
  });

  it("cautions appear in README and every checklist when mains-powered or driving a thyristor, and not otherwise", () => {
    const hazard = buildBundleSources(spec(TARGETS.slice(0, 2)));
    const lines = cautionLines({ name: "x", mainsPowered: true, drivesThyristor: true });
    for (const f of hazard.filter((x) => x.path === "README.md" || x.path.endsWith("CHECKLIST.md"))) {
      for (const l of lines) expect(f.content).toContain(l);
      expect(f.content).toMatch(/lock/i);
      expect(f.content).toMatch(/absence of voltage/i);
    }
    const safe = buildBundleSources(
      spec(TARGETS.slice(0, 2), { mainsPowered: false, drivesThyristor: false }),
    );
    for (const f of safe) expect(f.content).not.toMatch(/Caution|lock it out/);
  });

  it("user text cannot close a C comment, break a line or a Markdown table", () => {
    const files = buildBundleSources(
      spec(TARGETS.slice(0, 1), { name: "Oven */ int x; /*\nrow | 2", site: "A|B", assetTag: "T`1`" }),
    );
    const main = textOf(files.find((f) => f.path === "atmega328p/src/main.c")!);
    const header = main.slice(0, main.indexOf("*/") + 2);
    expect(header).toContain("Oven * / int x; / * row | 2");
    expect(main).not.toContain("int x;\n");
    const readme = files.find((f) => f.path === "README.md")!.content;
    expect(readme).toContain("| Retrofit | Oven \\*/ int x; /\\* row \\| 2 |");
    expect(readme).toContain("| Site | A\\|B |");
  });

  it("an unplannable target throws the engine's typed error naming the target", () => {
    const bad = [...TARGETS.slice(0, 1), { device: "attiny85", clockHz: 8e6, periodS: 1e-9, highS: 0.5e-9 }];
    let err: unknown;
    try {
      buildBundleSources(spec(bad));
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(EngineError);
    expect((err as EngineError).message).toMatch(/target 2 \(attiny85\)/);
    expect((err as EngineError).field).toBe("targets.1");
  });
});
