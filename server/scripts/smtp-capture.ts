/**
 * Local SMTP capture server (stands in for a hosted mail service in development and tests).
 * SMTP on 127.0.0.1:SMTP_PORT (default 1025); an HTTP reader on 127.0.0.1:MAIL_CAPTURE_HTTP_PORT (1081):
 *   GET /messages            newest first, summaries
 *   GET /messages/:id        one message with text, html and attachment names
 *   GET /messages/:id/attachments/:n   the attachment's bytes
 *   DELETE /messages         forget everything
 */
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import express from 'express';

export interface CapturedMessage {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  /** The app's outbox row id (header X-Browseline-Message), so the app can show a firm only its own mail. */
  outboxId: number | null;
  subject: string;
  text: string;
  html: string | null;
  attachments: { filename: string; contentType: string; size: number; content: Buffer }[];
}

export interface SmtpCapture {
  smtpPort: number;
  httpPort: number;
  messages: CapturedMessage[];
  close(): Promise<void>;
}

/** Starts the SMTP listener and its HTTP reader; ports 0 pick free ones. */
export async function startSmtpCapture(opts: { smtpPort: number; httpPort: number; quiet?: boolean }): Promise<SmtpCapture> {
  const messages: CapturedMessage[] = [];
  let nextId = 1;
  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 25 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          const to = session.envelope.rcptTo.map((r) => r.address);
          const outboxHeader = Number(mail.headers.get('x-browseline-message'));
          messages.unshift({
            id: nextId++,
            receivedAt: new Date().toISOString(),
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to,
            outboxId: Number.isInteger(outboxHeader) && outboxHeader > 0 ? outboxHeader : null,
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
            attachments: mail.attachments.map((a) => ({ filename: a.filename ?? 'attachment', contentType: a.contentType, size: a.size, content: a.content })),
          });
          if (messages.length > 500) messages.length = 500;
          if (!opts.quiet) console.log(JSON.stringify({ service: 'smtp-capture', msg: 'captured', to, subject: mail.subject }));
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(opts.smtpPort, '127.0.0.1', () => resolve());
  });

  const app = express();
  const summary = (m: CapturedMessage) => ({ id: m.id, receivedAt: m.receivedAt, from: m.from, to: m.to, outboxId: m.outboxId, subject: m.subject, attachments: m.attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, size: a.size })) });
  app.get('/messages', (_req, res) => res.json({ data: messages.map(summary) }));
  app.get('/messages/:id', (req, res) => {
    const m = messages.find((x) => x.id === Number(req.params.id));
    if (!m) return res.status(404).json({ error: 'No such message.' });
    res.json({ data: { ...summary(m), text: m.text, html: m.html } });
  });
  app.get('/messages/:id/attachments/:n', (req, res) => {
    const m = messages.find((x) => x.id === Number(req.params.id));
    const a = m?.attachments[Number(req.params.n)];
    if (!a) return res.status(404).json({ error: 'No such attachment.' });
    res.type(a.contentType).send(a.content);
  });
  app.delete('/messages', (_req, res) => {
    messages.length = 0;
    res.status(204).end();
  });
  const server = http.createServer(app);
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.httpPort, '127.0.0.1', () => resolve());
  });

  return {
    smtpPort: (smtp.server.address() as AddressInfo).port,
    httpPort: (server.address() as AddressInfo).port,
    messages,
    close: async () => {
      await new Promise<void>((resolve) => smtp.close(() => resolve()));
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

// Run directly: `tsx server/scripts/smtp-capture.ts`
if (import.meta.url === `file://${process.argv[1]}`) {
  const capture = await startSmtpCapture({
    smtpPort: Number(process.env.SMTP_PORT ?? 1025),
    httpPort: Number(process.env.MAIL_CAPTURE_HTTP_PORT ?? 1081),
  });
  console.log(JSON.stringify({ service: 'smtp-capture', msg: 'listening', smtp: capture.smtpPort, http: capture.httpPort }));
}
