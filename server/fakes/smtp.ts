/**
 * A local stand-in for a mail provider: a real SMTP server (the
 * `smtp-server` package) on loopback that accepts every message, parses it
 * with mailparser and keeps it in memory, and optionally in a JSON file.
 * No TLS, no authentication: it only listens on 127.0.0.1.
 */
import { randomUUID } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { ApiOutboxMessage } from '../../shared/api-schemas.ts';

/** Read access to received messages (what the dev outbox route needs). */
export interface Outbox {
  /** Messages, newest first. */
  list(): ApiOutboxMessage[];
}

/** A running fake SMTP server. */
export interface FakeSmtp extends Outbox {
  host: string;
  port: number;
  /** Forgets every message (and empties the file). */
  clear(): void;
  /** Resolves with the newest message to `to`, waiting up to `timeoutMs` (default 5000) for one to arrive. */
  waitFor(to: string, timeoutMs?: number): Promise<ApiOutboxMessage>;
  close(): Promise<void>;
}

/** Options: `port` 0 picks a free port; `outboxDir` keeps `messages.json` there across restarts. */
export interface FakeSmtpOptions { port: number; host?: string; outboxDir?: string; maxMessages?: number }

/** Recipient addresses of a stored message (`to` is a comma-separated list). */
const recipients = (m: ApiOutboxMessage) => m.to.split(',').map((a) => a.trim().toLowerCase());

const LINK = /https?:\/\/[^\s<>"')\]]+/g;

function addresses(a: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(a) ? a : a ? [a] : [];
  return list.flatMap((o) => o.value.map((v) => v.address ?? '')).filter(Boolean);
}

/** Starts the fake SMTP server and resolves once it listens. */
export async function startFakeSmtp(opts: FakeSmtpOptions): Promise<FakeSmtp> {
  const host = opts.host ?? '127.0.0.1';
  const max = opts.maxMessages ?? 500;
  const file = opts.outboxDir ? path.join(opts.outboxDir, 'messages.json') : null;
  let messages: ApiOutboxMessage[] = [];
  if (file) {
    mkdirSync(path.dirname(file), { recursive: true });
    try {
      messages = JSON.parse(readFileSync(file, 'utf8')) as ApiOutboxMessage[];
    } catch {
      messages = [];
    }
  }
  const waiters: { to: string; resolve: (m: ApiOutboxMessage) => void }[] = [];
  const persist = () => { if (file) writeFileSync(file, JSON.stringify(messages, null, 2)); };

  const server = new SMTPServer({
    secure: false,
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    banner: 'Loopwright local mail catcher',
    size: 10 * 1024 * 1024,
    logger: false,
    async onData(stream, session, callback) {
      try {
        const parsed = await simpleParser(stream);
        const text = parsed.text ?? '';
        const html = typeof parsed.html === 'string' ? parsed.html : '';
        const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
        const message: ApiOutboxMessage = {
          id: randomUUID(),
          to: (envelopeTo.length ? envelopeTo : addresses(parsed.to)).join(', '),
          subject: parsed.subject ?? '',
          text,
          html,
          links: [...new Set(text.match(LINK) ?? [])],
          receivedAt: new Date().toISOString(),
        };
        messages = [message, ...messages].slice(0, max);
        persist();
        for (const w of [...waiters]) {
          if (recipients(message).includes(w.to)) {
            waiters.splice(waiters.indexOf(w), 1);
            w.resolve(message);
          }
        }
        callback();
      } catch (err) {
        callback(err instanceof Error ? err : new Error(String(err)));
      }
    },
  });

  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port, host, () => { server.off('error', reject); resolve(); });
  });
  const address = server.server.address();
  const port = typeof address === 'object' && address ? address.port : opts.port;

  return {
    host,
    port,
    list: () => [...messages],
    clear() { messages = []; persist(); },
    waitFor(to, timeoutMs = 5000) {
      const found = messages.find((m) => recipients(m).includes(to));
      if (found) return Promise.resolve(found);
      return new Promise((resolve, reject) => {
        const entry = { to, resolve: (m: ApiOutboxMessage) => { clearTimeout(timer); resolve(m); } };
        const timer = setTimeout(() => { waiters.splice(waiters.indexOf(entry), 1); reject(new Error(`no mail to ${to} within ${timeoutMs} ms`)); }, timeoutMs);
        waiters.push(entry);
      });
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
