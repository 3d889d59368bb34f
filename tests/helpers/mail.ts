/**
 * A real local mailbox for tests: the project's fake SMTP server on a free loopback port, the
 * nodemailer SMTP transport pointed at it, and the .eml files it keeps parsed with mailparser.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { simpleParser, type ParsedMail } from 'mailparser';
import { startFakeSmtp } from '../../server/mail/fake-smtp';
import { smtpMailer, type Mailer } from '../../server/mail/mailer';

export interface Mailbox {
  mailer: Mailer;
  dir: string;
  /** Every message so far, oldest first. */
  messages(): Promise<ParsedMail[]>;
  /** Waits for a message to `to` whose subject matches. */
  waitFor(to: string, subject: RegExp, timeoutMs?: number): Promise<ParsedMail>;
  close(): Promise<void>;
}

const recipients = (m: ParsedMail) =>
  (Array.isArray(m.to) ? m.to : m.to ? [m.to] : []).flatMap((a) => a.value.map((v) => (v.address ?? '').toLowerCase()));

export async function startMailbox(): Promise<Mailbox> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'frameside-mail-'));
  const smtp = await startFakeSmtp({ dir });
  const mailer = smtpMailer({ host: '127.0.0.1', port: smtp.port, from: 'Frameside <no-reply@frameside.test>', ignoreTLS: true });
  const messages = async () => {
    const files = fs.readdirSync(dir).filter((f) => f.endsWith('.eml')).sort();
    return Promise.all(files.map(async (f) => simpleParser(fs.readFileSync(path.join(dir, f)))));
  };
  return {
    mailer,
    dir,
    messages,
    async waitFor(to, subject, timeoutMs = 5000) {
      const until = Date.now() + timeoutMs;
      for (;;) {
        const found = (await messages()).filter((m) => recipients(m).includes(to.toLowerCase()) && subject.test(m.subject ?? ''));
        if (found.length) return found[found.length - 1]!;
        if (Date.now() > until) throw new Error(`no mail to ${to} matching ${subject} within ${timeoutMs} ms`);
        await new Promise((r) => setTimeout(r, 50));
      }
    },
    async close() {
      await smtp.close();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** The first link in a message's text that starts with `${base}${prefix}`. */
export function linkIn(m: ParsedMail, prefix: string): string {
  const re = new RegExp(`https?://[^\\s]+${prefix.replace(/[/]/g, '\\/')}[A-Za-z0-9_-]+`);
  const hit = re.exec(m.text ?? '');
  if (!hit) throw new Error(`no ${prefix} link in: ${m.text}`);
  return hit[0];
}

/** The token at the end of a link. */
export const tokenOf = (link: string) => link.split('/').pop()!;
