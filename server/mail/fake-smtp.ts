import fs from 'node:fs';
import path from 'node:path';
import { SMTPServer } from 'smtp-server';

export interface FakeSmtp {
  port: number;
  dir: string;
  close(): Promise<void>;
}

/**
 * The local stand-in for a mail provider: an SMTP server on loopback that accepts every message
 * and keeps it as an .eml file, so a person (or a test) can open the links inside.
 */
export function startFakeSmtp({ dir, port = 0, host = '127.0.0.1' }: { dir: string; port?: number; host?: string }): Promise<FakeSmtp> {
  fs.mkdirSync(dir, { recursive: true });
  let seq = 0;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    banner: 'Frameside local mail',
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        // Time first so a plain name sort lists the messages in the order they came.
        const name = `${new Date().toISOString().replace(/[:.]/g, '-')}-${String(seq++).padStart(4, '0')}.eml`;
        fs.writeFile(path.join(dir, name), Buffer.concat(chunks), (err) => callback(err ?? null));
      });
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      const addr = server.server.address();
      const actual = typeof addr === 'object' && addr ? addr.port : port;
      resolve({ port: actual, dir, close: () => new Promise<void>((r) => server.close(() => r())) });
    });
  });
}
