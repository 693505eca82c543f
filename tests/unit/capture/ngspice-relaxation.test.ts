// A relaxation stage simulated by ngspice (Debian package "ngspice"), its
// trace exported as CSV and measured: our waveform period (IEEE Std
// 181-2011, successive rising 50 % instants) must agree with ngspice's own
// .meas of the period (successive rising crossings of 5 V). The trace comes
// from ngspice's adaptive time steps, so the time column is uneven.
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { measureCsv } from "@/lib/capture";

// 12 V supply, 10 k / 100 nF, fires at 8.16 V, releases at 2 V, 100 ohm
// discharge path: a threshold stage as a switch with hysteresis.
const NETLIST = `relaxation stage
.param vp=8.16 vv=2
V1 vs 0 12
R1 vs cap 10k
C1 cap 0 100n IC=2
S1 cap nd cap 0 SWMOD
.model SWMOD SW(VT={(vp+vv)/2} VH={(vp-vv)/2} RON=1m ROFF=1G)
R2 nd 0 100
.tran 1u 12m 0 1u UIC
.meas tran tper TRIG v(cap) VAL=5 RISE=2 TARG v(cap) VAL=5 RISE=3
.control
run
wrdata out.txt v(cap) v(nd)
.endc
.end
`;

function runNgspice(dir: string): string {
  try {
    return execFileSync("ngspice", ["-b", "stage.cir"], { cwd: dir, encoding: "utf8", timeout: 60_000 });
  } catch (e) {
    const err = e as NodeJS.ErrnoException;
    if (err.code === "ENOENT") {
      throw new Error("ngspice is not installed: apt-get install -y ngspice (the test command installs it)");
    }
    throw e;
  }
}

describe("ngspice relaxation stage", () => {
  const dir = mkdtempSync(path.join(os.tmpdir(), "capture-ngspice-"));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it("has the period ngspice measures", async () => {
    writeFileSync(path.join(dir, "stage.cir"), NETLIST);
    const log = runNgspice(dir);
    // ngspice exits 0 even when a .meas fails: a missing line is a failure.
    const meas = /tper\s*=\s*([0-9.eE+-]+)/.exec(log);
    expect(meas, `no tper line in ngspice output:\n${log}`).not.toBeNull();
    const tper = Number(meas![1]);

    // wrdata writes "time v(cap) time v(nd)" per line; export it as CSV.
    const rows = readFileSync(path.join(dir, "out.txt"), "utf8")
      .trim()
      .split("\n")
      .map((l) => l.trim().split(/\s+/).join(","));
    const csv = ["Source,ngspice transient", "Time (s),Capacitor (V),Time (s),Discharge (V)", ...rows].join(
      "\n",
    );
    const m = await measureCsv(csv);

    expect(m.columns.map((c) => c.role)).toEqual(["time", "voltage", "other", "voltage"]);
    expect(m.columns[m.measuredColumn].name).toBe("Capacitor");
    // 12 ms of ~0.97 ms periods.
    expect(m.periodS.count).toBeGreaterThanOrEqual(10);
    // Both interpolate linearly on ngspice's time points (<= 1 us apart), at
    // different levels: agree within 10 ppm (0.5 ppm seen here), successive
    // periods within 100 ppm.
    expect(Math.abs(m.periodS.mean / tper - 1)).toBeLessThan(1e-5);
    expect(m.periodS.max - m.periodS.min).toBeLessThan(1e-4 * tper);
    expect(m.warnings.map((w) => w.code)).toContain("uneven-sampling");
    // Closed form without the discharge: RC ln((Vs - Vv) / (Vs - Vp)); the
    // discharge through 100 ohm adds a little (RC charging, textbook).
    const charge = 1e-3 * Math.log(10 / 3.84);
    expect(m.periodS.mean).toBeGreaterThan(charge);
    expect(m.periodS.mean).toBeLessThan(charge * 1.05);
  });
});
