// A Clockgraft worker: runs revision generations and mail from the job queue.
// Start as many as you like on any machine that reaches the database
// (`npm run worker`); the queue hands each job to exactly one of them.
import { stopBoss, boss } from "@/lib/jobs/boss";
import { giveUpGeneration, runGenerateJob, type GenerateJob } from "@/lib/jobs/generate-job";
import { QUEUES } from "@/lib/jobs/queues";
import { sendOutboxRows, type SendMailJob } from "@/lib/mail/outbox";

async function main(): Promise<void> {
  const b = await boss();
  // One job at a time per worker: a generation runs compilers on all cores it has.
  await b.work<GenerateJob>(
    QUEUES.generateRevision,
    { batchSize: 1, pollingIntervalSeconds: 0.5, includeMetadata: true },
    async ([job]) => {
      try {
        const outcome = await runGenerateJob(job.data);
        console.log(
          `worker ${process.pid}: generation job ${job.id} revision ${outcome.revisionId} ${outcome.state}`,
        );
        return outcome;
      } catch (e) {
        // Last try spent: record the reason on the revision, so it does not stay "building" forever.
        if (job.retryCount >= job.retryLimit) {
          await giveUpGeneration(job.data, e instanceof Error ? e.message : String(e)).catch(() => {});
        }
        throw e;
      }
    },
  );
  await b.work<SendMailJob>(
    QUEUES.sendMail,
    { batchSize: 1, pollingIntervalSeconds: 0.5 },
    async ([job]) => ({
      sent: await sendOutboxRows(job.data),
    }),
  );
  // pg-boss 10 lets a failed bookkeeping write (its "fail" while PostgreSQL restarts)
  // escape its work loop as an unhandled rejection, which would end the process.
  // The job it could not record stays active and is retried after its expiry, so
  // the worker logs it and keeps serving.
  process.on("unhandledRejection", (err) => {
    console.error(
      `worker ${process.pid}: job queue bookkeeping failed:`,
      err instanceof Error ? err.message : err,
    );
  });
  console.log(`worker ${process.pid}: ready`);
  const stop = (signal: string) => {
    console.log(`worker ${process.pid}: ${signal}, finishing the running job`);
    stopBoss().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  };
  process.on("SIGTERM", () => stop("SIGTERM"));
  process.on("SIGINT", () => stop("SIGINT"));
}

main().catch((err) => {
  console.error("worker failed to start:", err);
  process.exit(1);
});
