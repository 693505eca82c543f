// One bounded load run with autocannon; latency percentiles come from every
// response's own time (autocannon's summary has no p95).
import autocannon from "autocannon";
import { percentile } from "./stats";

export interface LoadResult {
  requests: number;
  perSecond: number;
  p50Ms: number;
  p95Ms: number;
  p99Ms: number;
  /** Socket errors, timeouts and responses outside 2xx. */
  errors: number;
  /** Responses by HTTP status, plus "socket errors" and "timeouts" (no response). */
  statuses: Record<string, number>;
}

export function load(options: autocannon.Options): Promise<LoadResult> {
  const url = new URL(options.url);
  if (url.hostname !== "127.0.0.1") throw new Error(`load runs on loopback only, not ${url.hostname}`);
  const times: number[] = [];
  const statuses: Record<string, number> = {};
  return new Promise((resolve, reject) => {
    const instance = autocannon({ pipelining: 1, timeout: 10, ...options }, (err, r) => {
      if (err) return reject(err);
      if (r.timeouts) statuses.timeouts = r.timeouts;
      if (r.errors > r.timeouts) statuses["socket errors"] = r.errors - r.timeouts;
      resolve({
        requests: times.length,
        perSecond: times.length / r.duration,
        p50Ms: percentile(times, 50),
        p95Ms: percentile(times, 95),
        p99Ms: percentile(times, 99),
        // autocannon counts a timeout in `errors` as well.
        errors: r.errors + r.non2xx,
        statuses,
      });
    });
    instance.on("response", (_client, status, _bytes, ms) => {
      times.push(ms);
      statuses[status] = (statuses[status] ?? 0) + 1;
    });
  });
}
