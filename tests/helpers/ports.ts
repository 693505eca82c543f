// The server and mail-catcher addresses the tests talk to. scripts/test.sh
// picks free ports at run time (scripts/free-ports.mjs) and exports them;
// scripts/serve-dev.sh writes them to .data/run/NAME.env. There is no fixed
// fallback port: a run without them would silently talk to someone else's
// server on a shared machine, so it stops with a message naming the variable.
function required(name: "TEST_BASE_URL" | "MAIL_HTTP_URL"): string {
  const v = process.env[name];
  if (!v)
    throw new Error(
      `${name} is not set: run through scripts/test.sh, or source .data/run/NAME.env from scripts/serve-dev.sh`,
    );
  return v.replace(/\/$/, "");
}

export const testBaseUrl = () => required("TEST_BASE_URL");
export const mailHttpUrl = () => required("MAIL_HTTP_URL");
