// Runs the Debian emulators for the product's wrappers without blocking the
// event loop (execFile), with a wall-clock cap, and finds out once per
// process whether a tool is installed and which version it is.
import { execFile } from "node:child_process";

export interface ToolRun {
  /** Exit status; null when the run was killed (time cap) or did not start. */
  status: number | null;
  stdout: string;
  stderr: string;
  /** The wall-clock cap ended the run. */
  timedOut: boolean;
  /** The command is not installed (ENOENT). */
  missing: boolean;
}

export function runTool(
  command: string,
  args: string[],
  opts: { timeoutMs: number; cwd?: string; maxBuffer?: number },
): Promise<ToolRun> {
  return new Promise((resolve) => {
    // Our own cap, not execFile's `timeout`: when that fires between the child's exit and the end of
    // its output, execFile cuts the output short and still reports a clean exit (seen under CI load
    // as a judged run on half an output). Past the cap the run counts as stopped whatever it printed.
    let capped = false;
    const child = execFile(
      command,
      args,
      {
        cwd: opts.cwd,
        maxBuffer: opts.maxBuffer ?? 64 * 1024 * 1024,
        encoding: "utf8",
        env: {
          NODE_ENV: process.env.NODE_ENV,
          PATH: process.env.PATH ?? "/usr/bin:/bin",
          LC_ALL: "C",
          HOME: process.env.HOME ?? "/tmp",
        },
      },
      (error, stdout, stderr) => {
        clearTimeout(timer);
        const e = error as (NodeJS.ErrnoException & { killed?: boolean; code?: string | number }) | null;
        resolve({
          status: e ? (typeof e.code === "number" ? e.code : null) : 0,
          stdout: String(stdout),
          stderr: String(stderr),
          timedOut: capped,
          missing: e?.code === "ENOENT",
        });
      },
    );
    const timer = setTimeout(() => {
      capped = true;
      child.kill("SIGKILL");
    }, opts.timeoutMs);
  });
}

/** CLOCKGRAFT_EMULATORS_OFF=1 turns every emulator wrapper off (they then answer not-emulated). */
export function emulatorsOff(): boolean {
  return process.env.CLOCKGRAFT_EMULATORS_OFF === "1";
}

const versions = new Map<string, Promise<string | null>>();

/**
 * The tool's version line, or null when it is not installed or does not run.
 * `pick` chooses the line from the output. Cached per process (a tool is not
 * installed while the worker runs); `forget` clears the cache for tests.
 */
export function toolVersion(
  key: string,
  command: string,
  args: string[],
  pick: (output: string) => string | null,
): Promise<string | null> {
  let p = versions.get(key);
  if (!p) {
    p = runTool(command, args, { timeoutMs: 20_000 }).then((r) =>
      r.missing || r.timedOut ? null : pick(`${r.stdout}\n${r.stderr}`),
    );
    versions.set(key, p);
  }
  return p;
}

export function forgetToolVersions(): void {
  versions.clear();
}
