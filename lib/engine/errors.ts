// Typed engine errors. Every refusal of the engine is one of these, never a
// plain Error and never a wrong number: callers (API, UI, bundle) map `code`
// to a status and show `message`, and `field` to the input that caused it.

export type EngineErrorCode =
  | "invalid-stage" // a stage field is missing, not finite, out of physical range
  | "invalid-value" // a value string could not be read (engineering notation)
  | "unknown-device"
  | "unknown-timer"
  | "invalid-request" // a plan request field is missing or not finite
  | "clock-out-of-range"
  | "unreachable-period" // no mode of the device can make the period
  | "invalid-high-time";

export class EngineError extends Error {
  readonly code: EngineErrorCode;
  readonly field?: string;

  constructor(code: EngineErrorCode, message: string, field?: string) {
    super(message);
    this.name = "EngineError";
    this.code = code;
    this.field = field;
  }
}

export function isEngineError(value: unknown): value is EngineError {
  return value instanceof EngineError;
}
