// The job queues and their retry rules. A job whose worker dies (SIGKILL, lost
// machine) stays "active" until its expiry; pg-boss's maintenance then fails it
// and, within the retry limit, runs it again on any worker.
export const QUEUES = {
  generateRevision: "revision-generate",
  sendMail: "mail-send",
} as const;

export type QueueName = (typeof QUEUES)[keyof typeof QUEUES];

/** Seconds a job may run before it counts as lost; tests shorten it with CLOCKGRAFT_JOB_EXPIRE_SECONDS. */
function expireSeconds(fallback: number): number {
  const v = Number(process.env.CLOCKGRAFT_JOB_EXPIRE_SECONDS);
  return Number.isFinite(v) && v > 0 ? v : fallback;
}

export function queueOptions(name: QueueName): {
  retryLimit: number;
  retryDelay: number;
  expireInSeconds: number;
} {
  switch (name) {
    // Compilers and emulators for six targets take seconds, not minutes.
    case QUEUES.generateRevision:
      return { retryLimit: 3, retryDelay: 1, expireInSeconds: expireSeconds(300) };
    // Mail waits out an SMTP outage: ten tries, a minute apart.
    case QUEUES.sendMail:
      return { retryLimit: 10, retryDelay: 60, expireInSeconds: expireSeconds(60) };
  }
}
