// Tasks that share a key run one after another in this process; tasks with
// other keys run freely. Generation uses it per retrofit, so a burst for one
// retrofit waits here in memory instead of each request holding a pool
// connection while it waits for the retrofit's row lock. The row lock stays
// the rule between processes; this only keeps one process from queueing on it
// with many connections at once.
const tails = new Map<string, Promise<void>>();

export function oneAtATime<T>(key: string, task: () => Promise<T>): Promise<T> {
  const before = tails.get(key) ?? Promise.resolve();
  const run = before.then(task);
  const tail = run.then(
    () => undefined,
    () => undefined,
  );
  tails.set(key, tail);
  void tail.then(() => {
    if (tails.get(key) === tail) tails.delete(key);
  });
  return run;
}
