/** Development only: the fake SMTP server's mailbox as a plain page, newest first. */
import type { RequestHandler } from 'express';
import { readMailbox } from './fake-smtp';

const escape = (s: string) =>
  s.replace(/[&<>"]/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;' })[c]!);
const linkify = (s: string) => s.replace(/(https?:\/\/[^\s<]+)/g, '<a href="$1">$1</a>');

export function mailboxPage(dir: string): RequestHandler {
  return (_req, res) => {
    const mails = readMailbox(dir).reverse();
    const items = mails
      .map(
        (m) =>
          `<article><h2>${escape(m.subject)}</h2><p>to ${escape(m.to)} · ${escape(m.receivedAt)}</p><pre>${linkify(escape(m.text))}</pre></article>`,
      )
      .join('');
    res.setHeader('Cache-Control', 'no-store');
    res.send(
      `<!doctype html><meta charset="utf-8"><title>Saltation — local mailbox</title><style>body{font-family:sans-serif;max-width:50rem;margin:2rem auto;padding:0 1rem}pre{white-space:pre-wrap}article{border-top:1px solid #ccc}</style><h1>Local mailbox (development)</h1><p>${mails.length} message(s) caught by the fake SMTP server.</p>${items}`,
    );
  };
}
