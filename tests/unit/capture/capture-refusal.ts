import { expect } from "vitest";
import { isCaptureError, type CaptureError } from "@/lib/capture";

/** Runs `run` and returns the CaptureError it must throw (fails the test otherwise). */
export async function captureRefusal(run: () => Promise<unknown>): Promise<CaptureError> {
  try {
    await run();
  } catch (e) {
    expect(isCaptureError(e)).toBe(true);
    return e as CaptureError;
  }
  throw new Error("expected a CaptureError");
}
