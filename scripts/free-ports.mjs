// Prints N TCP ports that are free on 127.0.0.1 right now, space-separated:
//   read -r WEB SMTP HTTP < <(node scripts/free-ports.mjs 3)
// Each port comes from the kernel (listen on port 0); all N sockets stay open
// until every port is known so the N are distinct, then close. Two test runs
// on one machine get different ports instead of fighting over fixed ones.
import { createServer } from "node:net";

const n = Number(process.argv[2] ?? 1);
if (!Number.isInteger(n) || n < 1 || n > 16) {
  console.error("usage: node scripts/free-ports.mjs N   (N from 1 to 16)");
  process.exit(2);
}
const servers = await Promise.all(
  Array.from(
    { length: n },
    () =>
      new Promise((resolve, reject) => {
        const s = createServer();
        s.once("error", reject);
        s.listen(0, "127.0.0.1", () => resolve(s));
      }),
  ),
);
const ports = servers.map((s) => s.address().port);
await Promise.all(servers.map((s) => new Promise((r) => s.close(r))));
console.log(ports.join(" "));
