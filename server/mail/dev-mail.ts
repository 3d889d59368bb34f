import fs from 'node:fs';
import path from 'node:path';
import express, { type Router } from 'express';
import { simpleParser } from 'mailparser';

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
const linkify = (s: string) => esc(s).replace(/https?:\/\/[^\s<]+/g, (u) => `<a href="${u}">${u}</a>`);

const page = (title: string, body: string) =>
  `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${esc(title)}</title>` +
  `<style>body{font:17px/1.5 system-ui,sans-serif;max-width:760px;margin:24px auto;padding:0 16px;color:#1d1b16}a{color:#0b4f8a}` +
  `li{margin:12px 0}pre{white-space:pre-wrap;background:#f4f1ea;padding:12px;border-radius:8px}small{color:#4a463d}</style></head>` +
  `<body>${body}</body></html>`;

/**
 * Development only: the messages the local fake SMTP server kept, newest first, so a person can
 * follow an invitation or reset link without a real mailbox. Mounted only when the fake is in use.
 */
export function devMailRouter(dir: string): Router {
  const r = express.Router();
  r.get('/dev/mail', async (_req, res) => {
    const files = fs.existsSync(dir) ? fs.readdirSync(dir).filter((f) => f.endsWith('.eml')).sort().reverse().slice(0, 200) : [];
    const items = await Promise.all(
      files.map(async (f) => {
        const m = await simpleParser(fs.readFileSync(path.join(dir, f)));
        const to = Array.isArray(m.to) ? m.to.map((t) => t.text).join(', ') : (m.to?.text ?? '');
        return `<li><a href="/dev/mail/${encodeURIComponent(f)}">${esc(m.subject ?? '(no subject)')}</a><br><small>to ${esc(to)} · ${esc(m.date?.toISOString() ?? '')}</small></li>`;
      }),
    );
    res.type('html').send(
      page('Local mailbox', `<h1>Local mailbox</h1><p>Messages the development mail server received (kept in ${esc(dir)}).</p>${items.length ? `<ol>${items.join('')}</ol>` : '<p>No messages yet.</p>'}`),
    );
  });
  r.get('/dev/mail/:file', async (req, res) => {
    const file = path.basename(String(req.params.file));
    const full = path.join(dir, file);
    if (!file.endsWith('.eml') || !fs.existsSync(full)) return void res.status(404).type('html').send(page('Not found', '<p>No such message. <a href="/dev/mail">Back</a></p>'));
    const m = await simpleParser(fs.readFileSync(full));
    const to = Array.isArray(m.to) ? m.to.map((t) => t.text).join(', ') : (m.to?.text ?? '');
    res.type('html').send(
      page(m.subject ?? 'Message', `<p><a href="/dev/mail">← All messages</a></p><h1>${esc(m.subject ?? '')}</h1><p><small>to ${esc(to)} · ${esc(m.date?.toISOString() ?? '')}</small></p><pre>${linkify(m.text ?? '')}</pre>`),
    );
  });
  return r;
}
