// The local stand-in for a real mail relay: an SMTP server (smtp-server, from the nodemailer
// project) that accepts every message and keeps it, plus a small HTTP listing of what it kept,
// which the app's /api/v1/dev/mail reads. Started by `npm start` and `npm test`; never used when a
// real SMTP host is configured.
//   SMTP_PORT (default 2525)  FAKE_MAIL_HTTP_PORT (default 8025)  FAKE_MAIL_FILE (optional JSONL)
import { createServer } from 'node:http';
import { appendFileSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';

const smtpPort = Number(process.env.SMTP_PORT ?? 2525);
const httpPort = Number(process.env.FAKE_MAIL_HTTP_PORT ?? 8025);
const file = process.env.FAKE_MAIL_FILE;
const MAX_MESSAGES = 5000;

/** @type {Array<Record<string, unknown>>} */
let messages = [];
if (file && existsSync(file)) {
  messages = readFileSync(file, 'utf8')
    .split('\n')
    .filter(Boolean)
    .map((l) => JSON.parse(l));
}

const linkPattern = /https?:\/\/[^\s"'<>)]+/g;

function keep(message) {
  messages.push(message);
  if (messages.length > MAX_MESSAGES) messages = messages.slice(-MAX_MESSAGES);
  if (file) {
    mkdirSync(path.dirname(file), { recursive: true });
    appendFileSync(file, `${JSON.stringify(message)}\n`);
  }
}

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'],
  size: 10 * 1024 * 1024,
  logger: false,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((mail) => {
        const text = mail.text ?? '';
        const html = typeof mail.html === 'string' ? mail.html : '';
        keep({
          id: randomUUID(),
          receivedAt: new Date().toISOString(),
          from: mail.from?.text ?? session.envelope.mailFrom?.address ?? '',
          replyTo: mail.replyTo?.text ?? '',
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: mail.subject ?? '',
          text,
          html,
          links: [...new Set([...(text.match(linkPattern) ?? []), ...(html.match(linkPattern) ?? [])])],
          // Kept whole (base64) so tests can read an attached calculation sheet.
          attachments: mail.attachments.map((a) => ({
            filename: a.filename ?? '',
            contentType: a.contentType,
            size: a.size,
            contentBase64: a.content.toString('base64'),
          })),
        });
        callback();
      })
      .catch((err) => callback(err));
  },
});

const http = createServer((req, res) => {
  const url = new URL(req.url ?? '/', 'http://127.0.0.1');
  if (url.pathname === '/messages' && req.method === 'GET') {
    const to = url.searchParams.get('to');
    const list = to
      ? messages.filter((m) => m.to.some((a) => a.toLowerCase() === to.toLowerCase()))
      : messages;
    res.writeHead(200, { 'content-type': 'application/json' });
    res.end(JSON.stringify({ items: [...list].reverse() }));
    return;
  }
  if (url.pathname === '/messages' && req.method === 'DELETE') {
    messages = [];
    if (file) writeFileSync(file, '');
    res.writeHead(204).end();
    return;
  }
  res.writeHead(404, { 'content-type': 'application/json' });
  res.end('{"error":"not found"}');
});

smtp.listen(smtpPort, '127.0.0.1', () => {
  http.listen(httpPort, '127.0.0.1', () => {
    console.log(`fake SMTP on 127.0.0.1:${smtpPort}, kept messages at http://127.0.0.1:${httpPort}/messages`);
  });
});

function stop() {
  http.close();
  smtp.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 2000).unref();
}
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
