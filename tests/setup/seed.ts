// One fixed seed for every fast-check property in the unit suite, so a run
// is reproducible and a failure replays (flaky-pattern rule of issue 14).
// A property may still pass its own seed; FC_SEED overrides this one for an
// exploratory run (the failing seed is printed by fast-check).
import fc from "fast-check";

const seed = Number(process.env.FC_SEED ?? 20260214);
fc.configureGlobal({ seed, numRuns: 100 });
