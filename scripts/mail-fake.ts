/**
 * A local SMTP sink for development and tests: accepts every message on loopback,
 * keeps the last few hundred in memory and shows them on a small web page.
 *   SMTP  127.0.0.1:$MAIL_FAKE_SMTP_PORT (default 2525)
 *   HTTP  127.0.0.1:$MAIL_FAKE_HTTP_PORT (default 2580): /  (inbox page), /api/messages (JSON)
 */
import { createServer } from "node:http";
import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";

interface CapturedMail {
  id: number;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  receivedAt: string;
}

const smtpPort = Number(process.env.MAIL_FAKE_SMTP_PORT ?? 2525);
const httpPort = Number(process.env.MAIL_FAKE_HTTP_PORT ?? 2580);
const KEEP = 500;
const inbox: CapturedMail[] = [];
let nextId = 1;

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  logger: false,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((parsed) => {
        inbox.push({
          id: nextId++,
          from: parsed.from?.text ?? session.envelope.mailFrom?.toString() ?? "",
          to: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
          subject: parsed.subject ?? "",
          text: parsed.text ?? "",
          html: typeof parsed.html === "string" ? parsed.html : "",
          receivedAt: new Date().toISOString(),
        });
        if (inbox.length > KEEP) inbox.splice(0, inbox.length - KEEP);
        callback();
      })
      .catch((err: Error) => callback(err));
  },
});

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

function inboxPage(): string {
  const rows = [...inbox]
    .reverse()
    .map(
      (m) => `<article><header><b>${escapeHtml(m.subject)}</b><br><small>to ${escapeHtml(m.to.join(", "))} · ${m.receivedAt}</small></header>
<pre>${escapeHtml(m.text)}</pre></article>`,
    )
    .join("\n");
  return `<!doctype html><meta charset="utf-8"><title>Seriatim local mail</title>
<style>body{font:14px system-ui;margin:2rem;max-width:60rem;color:#1f2933}article{border:1px solid #d5dbe1;border-radius:6px;padding:.75rem 1rem;margin:.75rem 0}pre{white-space:pre-wrap}</style>
<h1>Local mail (${inbox.length})</h1><p>Messages the app sent through the local SMTP fake. Nothing leaves this machine.</p>${rows || "<p>No mail yet.</p>"}`;
}

const http = createServer((req, res) => {
  const url = new URL(req.url ?? "/", `http://127.0.0.1:${httpPort}`);
  if (url.pathname === "/api/messages" && req.method === "GET") {
    const to = url.searchParams.get("to")?.toLowerCase();
    const list = to ? inbox.filter((m) => m.to.includes(to)) : inbox;
    res.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify(list));
  } else if (url.pathname === "/api/messages" && req.method === "DELETE") {
    inbox.length = 0;
    res.writeHead(204).end();
  } else if (url.pathname === "/") {
    res.writeHead(200, { "content-type": "text/html; charset=utf-8" }).end(inboxPage());
  } else {
    res.writeHead(404).end("not found");
  }
});

smtp.listen(smtpPort, "127.0.0.1", () => {
  http.listen(httpPort, "127.0.0.1", () => {
    console.log(`mail fake: SMTP 127.0.0.1:${smtpPort}, inbox http://127.0.0.1:${httpPort}/`);
  });
});

function shutdown() {
  http.close();
  smtp.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 1000).unref();
}
process.on("SIGINT", shutdown);
process.on("SIGTERM", shutdown);
