/** Mail for a running service: SMTP_URL when set, else the local fake with its mailbox folder. */
import { join } from 'node:path';
import type { Config } from '../config';
import { startFakeSmtp } from './fake-smtp';
import { smtpMailer, type Mailer } from './mailer';

export interface MailSetup {
  mailer: Mailer;
  /** set when the fake is in use */
  mailboxDir?: string;
  close: () => Promise<void>;
}

export async function setUpMail(config: Pick<Config, 'smtpUrl' | 'dataDir'>): Promise<MailSetup> {
  if (config.smtpUrl) return { mailer: smtpMailer(config.smtpUrl), close: async () => undefined };
  const mailboxDir = join(config.dataDir, 'mailbox');
  const fake = await startFakeSmtp(mailboxDir);
  return { mailer: smtpMailer(fake.url), mailboxDir, close: fake.close };
}
