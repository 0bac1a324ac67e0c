/**
 * Mail for a running service: SMTP_URL when set, else (never in production) the local fake with
 * its mailbox folder.
 */
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

export async function setUpMail(
  config: Pick<Config, 'smtpUrl' | 'dataDir'> & { production?: boolean },
): Promise<MailSetup> {
  if (config.smtpUrl) return { mailer: smtpMailer(config.smtpUrl), close: async () => undefined };
  if (config.production) throw new Error('production mode never runs the fake mail server');
  const mailboxDir = join(config.dataDir, 'mailbox');
  const fake = await startFakeSmtp(mailboxDir);
  return { mailer: smtpMailer(fake.url), mailboxDir, close: fake.close };
}
