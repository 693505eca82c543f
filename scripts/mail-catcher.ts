// Local stand-in for a mail server: accepts SMTP on loopback, keeps every
// message as JSON under .data/mail/<port>/, and shows them over HTTP
// (GET / as a page, GET /messages.json for tests, DELETE /messages to clear).
//   tsx scripts/mail-catcher.ts --smtp 1025 --http 1080
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { createServer } from "node:http";
import path from "node:path";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

const arg = (name: string, fallback: number) => {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 ? Number(process.argv[i + 1]) : fallback;
};
const smtpPort = arg("smtp", 1025);
const httpPort = arg("http", 1080);
const store = path.resolve(".data/mail", String(smtpPort));
mkdirSync(store, { recursive: true });

type Stored = { id: string; from: string; to: string[]; subject: string; text: string; receivedAt: string };
let counter = readdirSync(store).length;

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  banner: "clockgraft local mail catcher",
  onData(stream, session, done) {
    simpleParser(stream)
      .then((mail) => {
        counter += 1;
        const id = String(counter).padStart(6, "0");
        const msg: Stored = {
          id,
          from: mail.from?.text ?? "",
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: mail.subject ?? "",
          text: mail.text ?? "",
          receivedAt: new Date().toISOString(),
        };
        writeFileSync(path.join(store, `${id}.json`), JSON.stringify(msg));
        done();
      })
      .catch((err: Error) => done(err));
  },
});
smtp.listen(smtpPort, "127.0.0.1");

const all = (): Stored[] =>
  readdirSync(store)
    .filter((f) => f.endsWith(".json"))
    .sort()
    .map((f) => JSON.parse(readFileSync(path.join(store, f), "utf8")) as Stored);

const esc = (s: string) =>
  s.replace(/[&<>"]/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;" })[c]!);

createServer((req, res) => {
  if (req.method === "DELETE" && req.url === "/messages") {
    for (const f of readdirSync(store)) rmSync(path.join(store, f));
    res.writeHead(204).end();
  } else if (req.url === "/messages.json") {
    res.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify(all()));
  } else {
    const rows = all()
      .reverse()
      .map(
        (m) =>
          `<article><h2>${esc(m.subject)}</h2><p>to ${esc(m.to.join(", "))} · ${esc(m.receivedAt)}</p><pre>${esc(m.text)}</pre></article>`,
      )
      .join("");
    res
      .writeHead(200, { "content-type": "text/html; charset=utf-8" })
      .end(
        `<!doctype html><title>Local mail</title><h1>Local mail (${all().length})</h1>${rows || "<p>No messages yet.</p>"}`,
      );
  }
}).listen(httpPort, "127.0.0.1");

console.log(`mail catcher: SMTP 127.0.0.1:${smtpPort}, messages at http://127.0.0.1:${httpPort}/`);
