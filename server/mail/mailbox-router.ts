import { Router } from 'express';

import type { FakeSmtpServer, ReceivedMail } from './fake-smtp';

/** What `GET /dev/mailbox.json` lists per message (newest first). */
export interface MailboxEntry {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  links: string[];
}

function toEntry(m: ReceivedMail): MailboxEntry {
  const { raw: _raw, ...entry } = m;
  return entry;
}

const escape = (s: string): string =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c,
  );

/** Body text as HTML with its links clickable (everything else escaped). */
function linkify(text: string): string {
  return text
    .split(/(https?:\/\/[^\s<>"]+)/g)
    .map((part, i) => (i % 2 ? `<a href="${escape(part)}">${escape(part)}</a>` : escape(part)))
    .join('');
}

function page(entries: MailboxEntry[]): string {
  const items = entries.length
    ? entries
        .map(
          (m) => `<article>
  <h2>${escape(m.subject || '(no subject)')}</h2>
  <p class="meta">To ${escape(m.to.join(', '))} · from ${escape(m.from)} · ${escape(m.receivedAt)}</p>
  <pre>${linkify(m.text)}</pre>
</article>`,
        )
        .join('\n')
    : '<p>No mail yet. Invitations and password resets sent by Rampart appear here.</p>';
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Rampart mailbox (development)</title>
<style>
body{font:16px/1.5 system-ui,sans-serif;max-width:60rem;margin:2rem auto;padding:0 1rem}
article{border:1px solid #8886;border-radius:8px;padding:0 1rem;margin:1rem 0}
.meta{color:#666;font-size:.9em}pre{white-space:pre-wrap;font:inherit}
</style></head>
<body><h1>Mailbox</h1>
<p>Development only: every message the local fake SMTP server received, newest first.
<a href="/dev/mailbox.json">JSON</a></p>
${items}
</body></html>`;
}

/**
 * `GET /dev/mailbox` (HTML) and `GET /dev/mailbox.json`: the fake SMTP server's messages. Only
 * mounted when a fake mailbox exists, which is never the case under NODE_ENV=production.
 */
export function mailboxRouter(mailbox: FakeSmtpServer): Router {
  const router = Router();
  const entries = (): MailboxEntry[] => [...mailbox.messages].reverse().map(toEntry);
  router.get('/mailbox.json', (_req, res) => {
    res.set('Cache-Control', 'no-store').json(entries());
  });
  router.get('/mailbox', (_req, res) => {
    res.set('Cache-Control', 'no-store').type('html').send(page(entries()));
  });
  return router;
}
