// The local fake SMTP server's captured mail, for people (GET /dev/inbox) and tests (/dev/inbox.json, and
// each attachment's bytes). Mounted only outside production, and only when the fakes run (server/fakes.ts).
import { Router } from 'express';
import type { Inbox } from '../fakes';
import { notFound } from '../errors';

const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

export function devInboxRoutes(inbox: Inbox) {
  const r = Router();

  r.get('/inbox.json', (_req, res) => {
    res.json({ messages: inbox.list().map(({ attachments, ...m }) => ({ ...m, attachments: attachments.map(({ content: _c, ...a }, index) => ({ ...a, index })) })) });
  });

  r.delete('/inbox', (_req, res) => {
    inbox.clear();
    res.status(204).end();
  });

  r.get('/inbox/:id/attachments/:index', (req, res) => {
    const m = inbox.list().find((x) => x.id === Number(req.params.id));
    const a = m?.attachments[Number(req.params.index)];
    if (!a) throw notFound('no such attachment');
    res.type(a.contentType).setHeader('Content-Disposition', `inline; filename="${a.filename.replace(/"/g, '')}"`);
    res.send(a.content);
  });

  r.get('/inbox', (_req, res) => {
    const items = inbox
      .list()
      .reverse()
      .map(
        (m) => `<article><h2>${esc(m.subject)}</h2><p class="meta">${esc(m.receivedAt)} · to ${esc(m.to.join(', '))} · from ${esc(m.from)}</p>
<pre>${esc(m.text)}</pre>${m.attachments.map((a, i) => `<p><a href="/dev/inbox/${m.id}/attachments/${i}">${esc(a.filename)}</a> (${esc(a.contentType)}, ${Math.round(a.size / 1024)} KB)</p>`).join('')}</article>`,
      )
      .join('');
    res.type('html').send(`<!doctype html><html><head><meta charset="utf-8"><meta name="viewport" content="width=device-width"><title>Falloff dev inbox</title>
<style>body{font:15px/1.45 system-ui,sans-serif;max-width:760px;margin:24px auto;padding:0 16px;background:#f4f3ef;color:#1b1c1e}article{background:#fff;border:1px solid #dcdcd8;border-radius:8px;padding:12px 16px;margin:12px 0}h2{font-size:17px;margin:0}.meta{color:#62646a;font-size:13px}pre{white-space:pre-wrap;font:13px/1.4 ui-monospace,monospace}</style></head>
<body><h1>Dev inbox</h1><p class="meta">Every e-mail the app sent through the local fake SMTP server since it started (newest first). Nothing here left this machine.</p>${items || '<p>No mail yet.</p>'}</body></html>`);
  });

  return r;
}
