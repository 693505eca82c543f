// Tests that need a Debian tool call this first: a missing tool fails the
// test with the package to install, never a silent skip.
import { spawnSync } from "node:child_process";

export function requireTool(command: string, debianPackage: string): void {
  const r = spawnSync("sh", ["-c", `command -v ${command}`], { encoding: "utf8" });
  if (r.status !== 0) {
    throw new Error(
      `${command} is not installed: apt-get install -y ${debianPackage} (scripts/test.sh installs it)`,
    );
  }
}

export interface RunResult {
  status: number | null;
  stdout: string;
  stderr: string;
}

export function run(command: string, args: string[], cwd: string, timeoutMs = 60_000): RunResult {
  const r = spawnSync(command, args, { cwd, encoding: "utf8", timeout: timeoutMs });
  if (r.error) throw r.error;
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** Run and throw with the tool's own output when it fails. */
export function mustRun(command: string, args: string[], cwd: string, timeoutMs = 60_000): RunResult {
  const r = run(command, args, cwd, timeoutMs);
  if (r.status !== 0) {
    throw new Error(`${command} ${args.join(" ")} failed (${r.status}) in ${cwd}:\n${r.stderr}${r.stdout}`);
  }
  return r;
}
