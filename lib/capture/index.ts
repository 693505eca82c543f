// Scope-capture contract: read a CSV/TSV trace export and measure it per
// IEEE Std 181-2011. Plain TypeScript (TextDecoder only), usable on the
// server and in the browser.
export { CaptureError, isCaptureError, type CaptureErrorCode } from "./errors";
export { MAX_CAPTURE_BYTES } from "./text-source";
export { parseCapture } from "./parse-lines";
export { measureCsv, measureTrace, MAX_EDGES } from "./measure";
export { measureRamp, standoffRatio, type RampMeasurement } from "./ramp";
export { decimateEnvelope, PLOT_POINTS } from "./decimate";
export type * from "./types";
export {
  choiceOf,
  choiceOptions,
  readChoice,
  MAX_CHANNEL,
  PROBE_CHOICES,
  type CaptureChoice,
} from "./choice";
