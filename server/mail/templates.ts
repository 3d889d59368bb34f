/** The words of every e-mail Frameside sends; plain text first, for any mail program. */
import type { MailMessage } from './mailer';

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

const day = (d: Date) => d.toISOString().slice(0, 10);

function html(paragraphs: string[], link?: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p>${esc(p).replace(/\n/g, '<br>')}</p>`).join('\n');
  const a = link ? `<p><a href="${esc(link.href)}">${esc(link.label)}</a></p>` : '';
  return `<!doctype html><html><body style="font-family:sans-serif;font-size:16px;line-height:1.5">${body}${a}</body></html>`;
}

const ROLE_WORDS: Record<string, string> = {
  owner: 'an owner (everything, including who has access)',
  keeper: 'a keeper (all hives and records)',
  sitter: 'a sitter (the everyday care while the owner is away)',
  viewer: 'a viewer (read only)',
};

export function invitationMail(p: {
  to: string;
  inviterName: string;
  apiaryName: string;
  role: string;
  startsAt: Date | null;
  endsAt: Date | null;
  link: string;
  expiresAt: Date;
}): MailMessage {
  const window = p.startsAt && p.endsAt ? `Your access runs from ${day(p.startsAt)} until ${day(p.endsAt)}.` : '';
  const lines = [
    `${p.inviterName} invites you to the apiary "${p.apiaryName}" in Frameside as ${ROLE_WORDS[p.role] ?? p.role}.`,
    window,
    `Open this link to accept (it works once and until ${day(p.expiresAt)}):`,
  ].filter(Boolean);
  return {
    to: p.to,
    subject: `Invitation to ${p.apiaryName} in Frameside`,
    text: `${lines.join('\n\n')}\n\n${p.link}\n\nIf you did not expect this, ignore this e-mail.`,
    html: html([...lines.slice(0, -1), lines[lines.length - 1]!], { href: p.link, label: 'Accept the invitation' }),
  };
}

export function passwordResetMail(p: { to: string; link: string; expiresAt: Date }): MailMessage {
  const lines = [
    'Someone asked to reset the password of your Frameside account.',
    `Open this link to choose a new password. It works once, until ${p.expiresAt.toISOString().slice(0, 16).replace('T', ' ')} UTC:`,
  ];
  return {
    to: p.to,
    subject: 'Reset your Frameside password',
    text: `${lines.join('\n\n')}\n\n${p.link}\n\nIf it was not you, ignore this e-mail; your password stays as it is.`,
    html: html(lines, { href: p.link, label: 'Choose a new password' }),
  };
}

/** A plain-text brief (the handover, the digest) with one link to the full page. */
export function briefMail(p: { to: string; subject: string; lines: string[]; link: string; linkLabel: string }): MailMessage {
  return {
    to: p.to,
    subject: p.subject,
    text: `${p.lines.join('\n')}\n\n${p.linkLabel}: ${p.link}`,
    html: html([p.lines.join('\n')], { href: p.link, label: p.linkLabel }),
  };
}
