// The part of autocannon 9's API the benchmark uses (the package has no types).
declare module "autocannon" {
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    pipelining?: number;
    timeout?: number;
    method?: string;
    headers?: Record<string, string>;
    body?: string;
  }
  interface Result {
    duration: number;
    errors: number;
    timeouts: number;
    non2xx: number;
    requests: { total: number; average: number };
    throughput: { average: number };
  }
  interface Instance {
    on(
      event: "response",
      fn: (client: unknown, statusCode: number, resBytes: number, responseTimeMs: number) => void,
    ): void;
    on(event: "done", fn: (result: Result) => void): void;
  }
  function autocannon(options: Options, cb?: (err: Error | null, result: Result) => void): Instance;
  namespace autocannon {
    export type { Options, Result, Instance };
  }
  export default autocannon;
}
