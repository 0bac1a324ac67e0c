/** Outgoing e-mail through nodemailer to SMTP: a real server (SMTP_URL) or the local fake. */
import nodemailer from 'nodemailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
}

export const MAIL_FROM = 'Saltation <no-reply@saltation.invalid>';

export function smtpMailer(url: string): Mailer {
  const transport = nodemailer.createTransport(url);
  return {
    async send(mail) {
      await transport.sendMail({ from: MAIL_FROM, ...mail });
    },
  };
}
