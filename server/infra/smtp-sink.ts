/**
 * A local SMTP server that accepts every message and keeps it in memory: the development and
 * test stand-in for a real mail provider. The app sends through nodemailer exactly as it would
 * in production; only the SMTP URL differs.
 */
import { simpleParser } from 'mailparser';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';

export interface CapturedMail {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
}

export interface SmtpSink {
  url: string;
  port: number;
  messages: CapturedMail[];
  /** Resolves with the first message (already received or still to come) matching the predicate. */
  waitFor: (predicate: (m: CapturedMail) => boolean, timeoutMs?: number) => Promise<CapturedMail>;
  clear: () => void;
  close: () => Promise<void>;
}

export async function startSmtpSink(opts: { port?: number; max?: number } = {}): Promise<SmtpSink> {
  const messages: CapturedMail[] = [];
  const waiters = new Set<{ predicate: (m: CapturedMail) => boolean; resolve: (m: CapturedMail) => void }>();
  const max = opts.max ?? 500;
  let nextId = 1;

  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 5 * 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const to = Array.isArray(parsed.to) ? parsed.to.flatMap((a) => a.value) : (parsed.to?.value ?? []);
          const mail: CapturedMail = {
            id: nextId++,
            receivedAt: new Date().toISOString(),
            from: parsed.from?.text ?? '',
            to: to.map((a) => a.address ?? '').filter(Boolean),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
          };
          messages.push(mail);
          if (messages.length > max) messages.shift();
          for (const w of waiters) {
            if (w.predicate(mail)) {
              waiters.delete(w);
              w.resolve(mail);
            }
          }
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });

  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port ?? 0, '127.0.0.1', () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;

  return {
    url: `smtp://127.0.0.1:${port}`,
    port,
    messages,
    waitFor(predicate, timeoutMs = 5000) {
      const found = messages.find(predicate);
      if (found) return Promise.resolve(found);
      return new Promise((resolve, reject) => {
        const entry = { predicate, resolve: (m: CapturedMail) => { clearTimeout(timer); resolve(m); } };
        const timer = setTimeout(() => {
          waiters.delete(entry);
          reject(new Error('No matching e-mail arrived in time.'));
        }, timeoutMs);
        waiters.add(entry);
      });
    },
    clear: () => {
      messages.length = 0;
    },
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}
