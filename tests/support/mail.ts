/** A fake SMTP server with a throwaway mailbox for API and browser tests. */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readMailbox, startFakeSmtp, type StoredMail } from '../../server/mail/fake-smtp';
import { smtpMailer, type Mailer } from '../../server/mail/mailer';

export interface TestMail {
  mailer: Mailer;
  /** the fake's SMTP URL, for a service started in another process */
  url: string;
  dir: string;
  /** waits for a message to this address whose text matches, and returns the link in it */
  linkFor: (to: string, pattern: RegExp) => Promise<string>;
  all: () => StoredMail[];
  close: () => Promise<void>;
}

export async function testMail(): Promise<TestMail> {
  const dir = mkdtempSync(join(tmpdir(), 'saltation-mail-'));
  const fake = await startFakeSmtp(dir);
  return {
    mailer: smtpMailer(fake.url),
    url: fake.url,
    dir,
    all: () => readMailbox(dir),
    linkFor: async (to, pattern) => {
      for (let i = 0; i < 100; i++) {
        const mail = readMailbox(dir)
          .reverse()
          .find((m) => m.to === to && pattern.test(m.text));
        const link = mail?.text.match(/https?:\/\/\S+/)?.[0];
        if (link) return link;
        await new Promise((r) => setTimeout(r, 50));
      }
      throw new Error(`no mail to ${to} matching ${pattern}`);
    },
    close: async () => {
      await fake.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
