/**
 * The local SMTP fake: an SMTP server (smtp-server) that keeps every message it receives,
 * and a small JSON web view of them. The start command and the tests run it so no mail
 * ever leaves the machine. Never used in production: set SMTP_URL to a real relay there.
 *
 *   GET    /messages        newest first: [{ id, to, from, subject, text, html, date, workspaceId }]
 *
 * workspaceId comes from the X-Setwell-Workspace header the app puts on a workspace's mail
 * (null for mail of no workspace: password resets). This view shows everything, links included,
 * to whoever can reach 127.0.0.1; the app's outbox page shows a workspace only its own, redacted.
 *   GET    /messages/:id
 *   DELETE /messages        empties the box (tests)
 */
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import http from 'node:http';
import fs from 'node:fs';
import path from 'node:path';

interface StoredMessage {
  id: string;
  to: string[];
  from: string;
  subject: string;
  text: string;
  html: string;
  date: string;
  workspaceId: string | null;
}

const smtpPort = Number(process.env.MAIL_FAKE_SMTP_PORT ?? 2525);
const httpPort = Number(process.env.MAIL_FAKE_HTTP_PORT ?? 8025);
const storeFile = process.env.MAIL_FAKE_STORE; // optional: keep the outbox across restarts

function loadStore(): StoredMessage[] {
  if (!storeFile || !fs.existsSync(storeFile)) return [];
  try {
    return JSON.parse(fs.readFileSync(storeFile, 'utf8')) as StoredMessage[];
  } catch {
    return [];
  }
}

const messages: StoredMessage[] = loadStore();
let counter = messages.length;

function persist() {
  if (!storeFile) return;
  fs.mkdirSync(path.dirname(storeFile), { recursive: true });
  // Keep the newest 500 so the demo outbox never grows without bound.
  fs.writeFileSync(storeFile, JSON.stringify(messages.slice(0, 500)));
}

function headerText(value: unknown): string | null {
  return typeof value === 'string' && value.trim() ? value.trim() : null;
}

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'],
  logger: false,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((parsed) => {
        const toField = parsed.to ? (Array.isArray(parsed.to) ? parsed.to : [parsed.to]) : [];
        const recipients = session.envelope.rcptTo.map((r) => r.address);
        messages.unshift({
          id: String(++counter),
          to: recipients.length ? recipients : toField.flatMap((t) => t.value.map((v) => v.address ?? '')),
          from: parsed.from?.text ?? '',
          subject: parsed.subject ?? '',
          text: parsed.text ?? '',
          html: typeof parsed.html === 'string' ? parsed.html : '',
          date: new Date().toISOString(),
          workspaceId: headerText(parsed.headers.get('x-setwell-workspace')),
        });
        persist();
        callback();
      })
      .catch((err: Error) => callback(err));
  },
});

smtp.listen(smtpPort, '127.0.0.1', () => {
  console.log(`mail fake: SMTP on 127.0.0.1:${smtpPort}`);
});

const web = http.createServer((req, res) => {
  const url = new URL(req.url ?? '/', `http://127.0.0.1:${httpPort}`);
  const send = (status: number, body: unknown) => {
    res.writeHead(status, { 'content-type': 'application/json' });
    res.end(JSON.stringify(body));
  };
  if (url.pathname === '/messages' && req.method === 'GET') return send(200, messages);
  if (url.pathname === '/messages' && req.method === 'DELETE') {
    messages.length = 0;
    persist();
    return send(200, { ok: true });
  }
  const match = url.pathname.match(/^\/messages\/(\w+)$/);
  if (match && req.method === 'GET') {
    const found = messages.find((m) => m.id === match[1]);
    return found ? send(200, found) : send(404, { error: 'not found' });
  }
  if (url.pathname === '/health') return send(200, { ok: true });
  send(404, { error: 'not found' });
});

web.listen(httpPort, '127.0.0.1', () => {
  console.log(`mail fake: web view on http://127.0.0.1:${httpPort}/messages`);
});

for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    smtp.close(() => web.close(() => process.exit(0)));
    setTimeout(() => process.exit(0), 1000).unref();
  });
}
