import { createDb } from '../db/client';
import path from 'node:path';
import { createApp } from './app';
import { readEnv } from './env';
import { startJobs } from './jobs';
import { startFakeSmtp } from './mail/fake-smtp';
import { smtpMailer } from './mail/mailer';
import { createLogger } from './logger';
import { createLocalStorage } from './storage';

/** Reads the environment, builds the app and listens. `npm start` runs this after set-up. */
export async function start() {
  const env = readEnv();
  const logger = createLogger(env.LOG_LEVEL);
  const db = createDb(env.DATABASE_URL);
  const mailFake = env.MAIL_FAKE ? env.MAIL_FAKE === 'true' : env.NODE_ENV !== 'production';
  const mailDir = path.resolve(env.MAIL_DIR);
  const fake = mailFake ? await startLocalMail(env.SMTP_HOST, env.SMTP_PORT, mailDir, logger) : undefined;
  const mailer = smtpMailer({ host: env.SMTP_HOST, port: env.SMTP_PORT, from: env.MAIL_FROM, ignoreTLS: mailFake, logger });
  const { app, ctx } = createApp({
    mailer,
    publicUrl: env.PUBLIC_URL,
    devMailDir: mailFake ? mailDir : undefined,
    db,
    logger,
    sessionPassword: env.SESSION_PASSWORD,
    secureCookies: env.SECURE_COOKIES,
    trustProxy: env.TRUST_PROXY,
    webDir: env.WEB_DIR,
    storage: createLocalStorage(env.UPLOADS_DIR),
    devOrigin: env.NODE_ENV === 'development' ? env.DEV_ORIGIN : undefined,
  });
  const jobs = env.JOBS ? await startJobs(ctx, env.DATABASE_URL).catch((err: unknown) => {
    logger.error({ err }, 'scheduled jobs did not start; the app runs without the weekly digest');
    return undefined;
  }) : undefined;
  const server = app.listen(env.PORT, env.HOST, () => {
    logger.info({ url: `http://${env.HOST}:${env.PORT}` }, 'Frameside is listening');
    if (fake) logger.info({ mailbox: `http://${env.HOST}:${env.PORT}/dev/mail` }, 'local mailbox: e-mail is kept, not sent');
  });
  server.on('error', (err: NodeJS.ErrnoException) => {
    logger.fatal(err.code === 'EADDRINUSE' ? `Port ${env.PORT} is already in use; set PORT to another port.` : err.message);
    process.exit(1);
  });
  const stop = () => {
    void jobs?.stop().catch(() => undefined);
    void fake?.close();
    server.close(() => void db.$client.end().then(() => process.exit(0)));
    setTimeout(() => process.exit(0), 5000).unref();
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
  return server;
}

/** The local fake mail server; if its port is taken (another Frameside running), mail goes to that one. */
async function startLocalMail(host: string, port: number, dir: string, logger: ReturnType<typeof createLogger>) {
  try {
    const fake = await startFakeSmtp({ host, port, dir });
    logger.info({ port, dir }, 'local fake SMTP server is keeping mail');
    return fake;
  } catch (err) {
    logger.warn({ err: (err as Error).message, port }, 'the local mail port is in use; sending to whatever listens there');
    return undefined;
  }
}

if (require.main === module) {
  start().catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
