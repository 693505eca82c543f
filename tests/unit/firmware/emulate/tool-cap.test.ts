// The wall-clock cap of runTool (lib/firmware/emulate/harness/tool.ts). A run
// the cap ends must never come back as a clean exit with part of its output:
// the wrappers would judge half a simulator trace (seen once under CI load as
// an MSP430 run cut at 5 ms and judged "differs"). The shell line below makes
// the race certain instead of rare: the shell exits at once while a child it
// left behind still holds stdout open, so the cap fires after the exit and
// before the output ends (Node's execFile `timeout` then reports status 0 with
// the output cut short; common practice, no source: Node's child_process code).
import { describe, expect, it } from "vitest";
import { runTool } from "@/lib/firmware/emulate/harness/tool";

describe("runTool's wall-clock cap", () => {
  it("a cap that fires after the exit but before the output ends counts as stopped", async () => {
    const r = await runTool("sh", ["-c", "echo early; (sleep 0.4; echo late) & exit 0"], { timeoutMs: 100 });
    expect(r.timedOut).toBe(true);
    expect(r.status).toBe(0); // it did exit cleanly, and still is not taken as a whole run
  });

  it("a run inside its cap keeps its whole output and exit status", async () => {
    const r = await runTool("sh", ["-c", "echo early; (sleep 0.1; echo late) & wait; exit 3"], {
      timeoutMs: 5_000,
    });
    expect(r).toMatchObject({ timedOut: false, status: 3, missing: false });
    expect(r.stdout).toBe("early\nlate\n");
  });

  it("a run past its cap is stopped", async () => {
    const t0 = Date.now();
    const r = await runTool("sh", ["-c", "exec sleep 5"], { timeoutMs: 100 });
    expect(r.timedOut).toBe(true);
    expect(Date.now() - t0).toBeLessThan(4_000);
  });
});
