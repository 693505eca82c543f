// Run as a child process by determinism.test.ts with TZ set in its
// environment: prints the sha256 of the first fixture target's zip. A child
// gets the time zone from the start, instead of the test changing TZ for the
// whole test process (which other tests in the same worker would see).
import { buildBundleSources, sha256Hex, zipBundle } from "@/lib/bundle";
import { TARGETS, spec } from "./fixtures";

const zip = await zipBundle(buildBundleSources(spec(TARGETS.slice(0, 1))));
process.stdout.write(`${new Date(0).getTimezoneOffset()} ${sha256Hex(zip)}\n`);
