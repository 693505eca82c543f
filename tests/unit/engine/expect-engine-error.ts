import { expect } from "vitest";
import { EngineError } from "@/lib/engine";

/** Runs fn and expects an EngineError with this code (and field, when given). */
export function expectEngineError(fn: () => unknown, code: string, field?: string): EngineError {
  let caught: unknown;
  try {
    fn();
  } catch (e) {
    caught = e;
  }
  expect(caught, "expected an EngineError").toBeInstanceOf(EngineError);
  const err = caught as EngineError;
  expect(err.code).toBe(code);
  if (field !== undefined) {
    expect(err.field).toBe(field);
    expect(err.message).toContain(field.replace(/^tolerances\./, ""));
  }
  return err;
}
