// Development helpers: the caught-mail list. app.ts mounts this only when config.devTools is on.
import { Router } from 'express';
import { config } from '@/server/config';
import { readCaughtMails } from '@/server/mail/catcher';
import { escapeHtml } from '@/server/mail/mailer';

export const devRouter = Router();

devRouter.get('/api/dev/mail', (req, res) => {
  const to = typeof req.query.to === 'string' ? req.query.to : undefined;
  res.json({ mails: readCaughtMails(config.mail.caughtDir, to) });
});

const esc = escapeHtml;

devRouter.get('/dev/mail', (_req, res) => {
  const mails = readCaughtMails(config.mail.caughtDir);
  const rows = mails
    .map(
      (m) => `<article><h2>${esc(m.subject)}</h2><p class="meta">to ${esc(m.to.join(', '))} · ${esc(m.receivedAt)}</p>
      <pre>${esc(m.text)}</pre>${m.links.map((l) => `<p><a href="${esc(l)}">${esc(l)}</a></p>`).join('')}</article>`,
    )
    .join('');
  res.type('html').send(`<!doctype html><meta charset="utf-8"><meta name="viewport" content="width=device-width">
<title>Caught mail · Tactus (development)</title>
<style>body{font-family:system-ui,sans-serif;max-width:760px;margin:24px auto;padding:0 16px;background:#f6f3ec;color:#1d2327}
article{background:#fff;border-radius:12px;padding:12px 16px;margin:12px 0;box-shadow:0 1px 2px #0002}
.meta{color:#667;font-size:13px}pre{white-space:pre-wrap;font-family:inherit}</style>
<h1>Caught mail</h1><p>Development only: every message Tactus sent, newest first. Nothing here leaves this machine.</p>
${rows || '<p>No mail yet. Sign up in the app and the confirmation message appears here.</p>'}`);
});
