// Runs ngspice (Debian package "ngspice") in batch mode on a netlist and reads
// its .meas results. ngspice exits 0 even when a measurement fails (the line
// is then missing), so every requested name must appear or the run fails.
import { execFile, execFileSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";

export function requireNgspice(): void {
  try {
    execFileSync("ngspice", ["-v"], { stdio: "pipe" });
  } catch {
    throw new Error(
      "ngspice is not installed: run `apt-get install -y ngspice` (the project's test command installs it).",
    );
  }
}

/** Parses lines like `tper = 4.519590e-02 targ= ... trig= ...`. */
export function parseMeas(output: string, names: string[]): Record<string, number> {
  const result: Record<string, number> = {};
  for (const name of names) {
    const re = new RegExp(`^\\s*${name}\\s*=\\s*([-+0-9.eE]+)`, "mi");
    const m = re.exec(output);
    if (!m || !Number.isFinite(Number(m[1]))) {
      throw new Error(`ngspice printed no .meas result for "${name}":\n${output.slice(-2000)}`);
    }
    result[name] = Number(m[1]);
  }
  return result;
}

/**
 * Writes the netlist to a fresh folder, runs `ngspice -b` (asynchronously, so
 * several runs can go in parallel) and returns the requested measurements.
 */
export async function runNgspice(netlist: string, measNames: string[]): Promise<Record<string, number>> {
  requireNgspice();
  const dir = mkdtempSync(path.join(tmpdir(), "clockgraft-spice-"));
  try {
    const file = path.join(dir, "stage.cir");
    writeFileSync(file, netlist);
    const output = await new Promise<string>((resolve, reject) => {
      execFile(
        "ngspice",
        ["-b", file],
        { cwd: dir, encoding: "utf8", timeout: 60_000 },
        (err, stdout, stderr) => {
          if (err) reject(new Error(`ngspice failed: ${err.message}\n${stdout}\n${stderr}`));
          else resolve(stdout);
        },
      );
    });
    return parseMeas(output, measNames);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
