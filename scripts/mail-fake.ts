// The local mail catcher that stands in for a hosted relay in `npm start`, the tests and the bench:
// an SMTP server on loopback that keeps every message it accepts, and a small HTTP API to read
// them (the admin's "Caught mail" page and the tests use it). Each message keeps the company the
// sender named in its X-Keelson-Company header, so one company's administrator reads and clears
// only that company's messages.
//
//   GET    /messages[?company=][&to=]  newest first: id, messageId, company, from, to, subject, date,
//                               text, html, headers; `company` (an id) and `to` filter. The app
//                               always passes its company; the unfiltered form is for the tests.
//   DELETE /messages[?company=] forget that company's messages (all of them without `company`);
//                               answers { deleted: <how many> }
//   POST   /fail?count=N[&to=]  the next N SMTP transactions (to that recipient only, with `to`) get
//                               451, a temporary failure, as a relay in trouble answers
//   POST   /slow?ms=N[&to=]     wait N ms before accepting each message (to that recipient only,
//                               with `to`; 0 turns it off)
//   GET    /health
//
// KEELSON_SMTP_PORT, KEELSON_MAIL_FAKE_PORT; KEELSON_MAIL_FAKE_FILE (JSON lines, default
// .data/mail-fake/messages.jsonl) keeps the messages across restarts.
import { appendFileSync, existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { createServer, type ServerResponse } from "node:http";
import path from "node:path";
import { simpleParser } from "mailparser";
import { SMTPServer, type SMTPServerAddress } from "smtp-server";
import { envOf } from "../server/env";
import { COMPANY_HEADER, type CaughtMessage } from "../server/mail/contract";

/** `company`: the sender's X-Keelson-Company header, null on a message without one. */
type Caught = CaughtMessage & { company: string | null; headers: Record<string, string> };

// mailparser gives header keys in lower case.
const companyHeaderKey = COMPANY_HEADER.toLowerCase();

const config = envOf("KEELSON_SMTP_PORT", "KEELSON_MAIL_FAKE_PORT", "KEELSON_MAIL_FAKE_FILE");
const smtpPort = config.KEELSON_SMTP_PORT ?? 2525;
const apiPort = config.KEELSON_MAIL_FAKE_PORT;
const file = path.resolve(config.KEELSON_MAIL_FAKE_FILE);

mkdirSync(path.dirname(file), { recursive: true });
let messages: Caught[] = existsSync(file)
  ? readFileSync(file, "utf8")
      .split("\n")
      .filter(Boolean)
      .map((line) => JSON.parse(line) as Caught)
      // Lines kept before messages had their own `company` field still have the header.
      .map((m) => ({ ...m, company: m.company ?? m.headers[companyHeaderKey] ?? null }))
  : [];
// After a company's messages were cleared, the count no longer tells the next free id.
let nextId = messages.reduce((max, m) => Math.max(max, Number(m.id)), 0) + 1;
const failures: { to: string | null; left: number }[] = [];
/** Delay before the 250, by recipient ("*" for every message). */
const slowMs = new Map<string, number>();
const closedSessions = new Set<string>();

class SmtpReply extends Error {
  constructor(
    readonly responseCode: number,
    message: string,
  ) {
    super(message);
  }
}

/** Takes one failure off the budget that matches this recipient, if any. */
function takeFailure(address: string): boolean {
  const match = failures.find((f) => f.left > 0 && (f.to === null || f.to === address.toLowerCase()));
  if (!match) return false;
  match.left -= 1;
  return true;
}

const smtp = new SMTPServer({
  banner: "Keelson mail fake",
  disabledCommands: ["STARTTLS", "AUTH"],
  authOptional: true,
  logger: false,
  size: 10 * 1024 * 1024,
  onRcptTo(address: SMTPServerAddress, _session, callback) {
    if (takeFailure(address.address)) {
      callback(new SmtpReply(451, "4.3.0 Temporary failure (simulated by the Keelson mail fake)"));
      return;
    }
    callback();
  },
  onData(stream, session, callback) {
    simpleParser(stream)
      .then(async (parsed) => {
        const delay = Math.max(
          slowMs.get("*") ?? 0,
          ...session.envelope.rcptTo.map((r) => slowMs.get(r.address.toLowerCase()) ?? 0),
        );
        if (delay) await new Promise((resolve) => setTimeout(resolve, delay));
        // A client that went away before the 250 did not get its message delivered.
        if (closedSessions.has(session.id)) throw new SmtpReply(421, "4.4.2 Connection closed");
        const headers: Record<string, string> = {};
        for (const line of parsed.headerLines) headers[line.key] = line.line.slice(line.line.indexOf(":") + 1).trim();
        const caught: Caught = {
          id: String(nextId++),
          messageId: parsed.messageId ?? null,
          company: headers[companyHeaderKey] ?? null,
          from: parsed.from?.text ?? session.envelope.mailFrom?.toString() ?? "",
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: parsed.subject ?? "",
          date: new Date().toISOString(),
          text: parsed.text ?? "",
          html: typeof parsed.html === "string" ? parsed.html : null,
          headers,
        };
        messages.push(caught);
        appendFileSync(file, JSON.stringify(caught) + "\n");
        callback();
      })
      .catch((error: Error) => callback(error));
  },
  onClose(session) {
    closedSessions.add(session.id);
  },
});
// A client that drops the connection (a worker killed mid-send) is expected here, not an error.
smtp.on("error", (error: NodeJS.ErrnoException) => {
  if (error.code !== "ECONNRESET") console.error("[mail-fake] smtp error", error);
});

function send(res: ServerResponse, status: number, body: unknown) {
  res.writeHead(status, { "content-type": "application/json" });
  res.end(JSON.stringify(body));
}

const api = createServer((req, res) => {
  const url = new URL(req.url ?? "/", "http://127.0.0.1");
  if (req.method === "GET" && url.pathname === "/health") return send(res, 200, { ok: true, smtpPort });
  const company = url.searchParams.get("company");
  const ofCompany = (m: Caught) => company === null || m.company === company;
  if (req.method === "GET" && url.pathname === "/messages") {
    const to = url.searchParams.get("to")?.toLowerCase();
    const list = [...messages]
      .reverse()
      .filter((m) => ofCompany(m) && (!to || m.to.some((t) => t.toLowerCase() === to)));
    return send(res, 200, list);
  }
  if (req.method === "DELETE" && url.pathname === "/messages") {
    const kept = messages.filter((m) => !ofCompany(m));
    const deleted = messages.length - kept.length;
    messages = kept;
    writeFileSync(file, kept.map((m) => JSON.stringify(m) + "\n").join(""));
    return send(res, 200, { deleted });
  }
  if (req.method === "POST" && url.pathname === "/fail") {
    const count = Number(url.searchParams.get("count") ?? 1);
    if (!Number.isInteger(count) || count < 0) return send(res, 422, { detail: "count must be a whole number" });
    failures.push({ to: url.searchParams.get("to")?.toLowerCase() ?? null, left: count });
    return send(res, 200, { failNext: count });
  }
  if (req.method === "POST" && url.pathname === "/slow") {
    const ms = Number(url.searchParams.get("ms") ?? 0);
    if (!Number.isFinite(ms) || ms < 0) return send(res, 422, { detail: "ms must be zero or more" });
    const to = url.searchParams.get("to")?.toLowerCase() ?? "*";
    if (ms) slowMs.set(to, ms);
    else slowMs.delete(to);
    return send(res, 200, { slowMs: ms, to });
  }
  send(res, 404, { detail: "No such endpoint" });
});

smtp.listen(smtpPort, "127.0.0.1", () => {
  api.listen(apiPort, "127.0.0.1", () => {
    console.log(
      `[mail-fake] SMTP on 127.0.0.1:${smtpPort}, API on http://127.0.0.1:${apiPort}, ${messages.length} messages kept in ${file}`,
    );
  });
});

function stop() {
  api.close();
  smtp.close(() => process.exit(0));
  // Open SMTP sessions (a pooled client) would hold the close: do not wait for them long.
  setTimeout(() => process.exit(0), 1000).unref();
}
process.once("SIGTERM", stop);
process.once("SIGINT", stop);
