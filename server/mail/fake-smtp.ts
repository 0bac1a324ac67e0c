/**
 * The local fake SMTP server for development and tests (smtp-server): accepts every message
 * on loopback and keeps it, parsed by mailparser, as one JSON file in a mailbox folder.
 */
import { simpleParser } from 'mailparser';
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import { SMTPServer } from 'smtp-server';

export interface StoredMail {
  to: string;
  from: string;
  subject: string;
  text: string;
  receivedAt: string;
}

export interface FakeSmtp {
  url: string;
  port: number;
  close: () => Promise<void>;
}

let counter = 0;

export async function startFakeSmtp(mailbox: string, port = 0): Promise<FakeSmtp> {
  mkdirSync(mailbox, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((mail) => {
          const to = Array.isArray(mail.to) ? mail.to[0] : mail.to;
          const stored: StoredMail = {
            to: to?.value[0]?.address ?? '',
            from: mail.from?.value[0]?.address ?? '',
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            receivedAt: new Date().toISOString(),
          };
          const name = `${Date.now()}-${String(++counter).padStart(6, '0')}.json`;
          writeFileSync(join(mailbox, name), JSON.stringify(stored, null, 2));
          callback();
        })
        .catch((e: Error) => callback(e));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const actual = (server.server.address() as AddressInfo).port;
  return {
    port: actual,
    url: `smtp://127.0.0.1:${actual}`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

/** The messages in a mailbox folder, oldest first. */
export function readMailbox(mailbox: string): StoredMail[] {
  let names: string[];
  try {
    names = readdirSync(mailbox).filter((n) => n.endsWith('.json'));
  } catch {
    return [];
  }
  return names.sort().map((n) => JSON.parse(readFileSync(join(mailbox, n), 'utf8')) as StoredMail);
}
