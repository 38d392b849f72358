/**
 * A local stand-in for the studio's mail server: accepts SMTP on 127.0.0.1,
 * parses each message with mailparser and keeps it, and lists what it holds
 * over a small HTTP API (used by the owner's "sent mail" page in development
 * and by the tests). Nothing leaves the machine.
 *
 *   node --import tsx scripts/fakes/fake-smtp.ts   (FAKE_SMTP_PORT, FAKE_MAIL_API_PORT)
 */
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';

export interface CaughtMail {
  id: number;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  date: string;
  messageId: string | null;
  attachments: Array<{ filename: string; contentType: string; size: number; content: Buffer }>;
}

export interface FakeSmtp {
  smtpPort: number;
  apiPort: number;
  mails: CaughtMail[];
  /** Resolves when the next message starts arriving (to stop the server in the middle of a delivery). */
  receiving(): Promise<void>;
  /** Stops answering SMTP (as a mail server that is down); the API keeps going. */
  stopSmtp(): Promise<void>;
  startSmtp(): Promise<void>;
  close(): Promise<void>;
}

function listen(server: { listen: (port: number, host: string, cb: () => void) => unknown; once: (e: 'error', cb: (err: Error) => void) => unknown }, port: number): Promise<void> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
}

export async function startFakeSmtp(options: { smtpPort?: number; apiPort?: number; quiet?: boolean } = {}): Promise<FakeSmtp> {
  const mails: CaughtMail[] = [];
  let nextId = 1;
  let arriving: (() => void) | null = null;

  const makeSmtp = () =>
    new SMTPServer({
      disabledCommands: ['STARTTLS', 'AUTH'],
      authOptional: true,
      logger: false,
      size: 30 * 1024 * 1024,
      onData(stream, session, callback) {
        arriving?.();
        arriving = null;
        simpleParser(stream)
          .then((parsed) => {
            const to = session.envelope.rcptTo.map((r) => r.address);
            mails.push({
              id: nextId++,
              from: parsed.from?.text ?? session.envelope.mailFrom?.toString() ?? '',
              to,
              subject: parsed.subject ?? '',
              text: parsed.text ?? '',
              html: typeof parsed.html === 'string' ? parsed.html : '',
              date: (parsed.date ?? new Date()).toISOString(),
              messageId: parsed.messageId ?? null,
              attachments: parsed.attachments.map((a) => ({ filename: a.filename ?? 'attachment', contentType: a.contentType, size: a.size, content: a.content })),
            });
            if (!options.quiet) console.log(`fake mail: "${parsed.subject}" to ${to.join(', ')}`);
            callback();
          })
          .catch((err: Error) => callback(err));
      },
    });

  let smtp = makeSmtp();
  let smtpPort = options.smtpPort ?? 0;
  await listen(smtp.server as unknown as Server, smtpPort);
  smtpPort = (smtp.server.address() as AddressInfo).port;
  let smtpUp = true;

  const api = createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://localhost');
    const send = (status: number, body: unknown) => {
      res.writeHead(status, { 'Content-Type': 'application/json' });
      res.end(JSON.stringify(body));
    };
    if (req.method === 'GET' && url.pathname === '/messages') {
      return send(200, { items: mails.map(({ attachments, ...m }) => ({ ...m, attachments: attachments.map(({ content: _c, ...a }) => a) })) });
    }
    const match = url.pathname.match(/^\/messages\/(\d+)\/attachments\/(\d+)$/);
    if (req.method === 'GET' && match) {
      const attachment = mails.find((m) => m.id === Number(match[1]))?.attachments[Number(match[2])];
      if (!attachment) return send(404, { error: 'no such attachment' });
      res.writeHead(200, { 'Content-Type': attachment.contentType, 'Content-Disposition': `attachment; filename="${attachment.filename.replace(/"/g, '')}"` });
      return res.end(attachment.content);
    }
    if (req.method === 'DELETE' && url.pathname === '/messages') {
      mails.length = 0;
      return send(204, {});
    }
    send(404, { error: 'not found' });
  });
  await listen(api, options.apiPort ?? 0);
  const apiPort = (api.address() as AddressInfo).port;

  return {
    smtpPort,
    apiPort,
    mails,
    receiving: () => new Promise<void>((r) => (arriving = r)),
    async stopSmtp() {
      if (!smtpUp) return;
      smtpUp = false;
      await new Promise<void>((r) => smtp.close(() => r()));
    },
    async startSmtp() {
      if (smtpUp) return;
      smtp = makeSmtp();
      await listen(smtp.server as unknown as Server, smtpPort);
      smtpUp = true;
    },
    async close() {
      if (smtpUp) await new Promise<void>((r) => smtp.close(() => r()));
      smtpUp = false;
      await new Promise<void>((r) => api.close(() => r()));
    },
  };
}

if (require.main === module) {
  startFakeSmtp({ smtpPort: Number(process.env['FAKE_SMTP_PORT'] ?? 2525), apiPort: Number(process.env['FAKE_MAIL_API_PORT'] ?? 2526) })
    .then((f) => {
      console.log(`fake mail server: SMTP on 127.0.0.1:${f.smtpPort}, messages at http://127.0.0.1:${f.apiPort}/messages`);
      const stop = () => {
        setTimeout(() => process.exit(0), 2000).unref();
        void f.close().then(() => process.exit(0));
      };
      process.on('SIGINT', stop);
      process.on('SIGTERM', stop);
    })
    .catch((err: Error) => {
      console.error(`fake mail server: ${err.message}`);
      process.exit(1);
    });
}
