import { createDb } from '../db/client';
import { createApp } from './app';
import { readEnv } from './env';
import { createLogger } from './logger';

/** Reads the environment, builds the app and listens. `npm start` runs this after set-up. */
export async function start() {
  const env = readEnv();
  const logger = createLogger(env.LOG_LEVEL);
  const db = createDb(env.DATABASE_URL);
  const { app } = createApp({
    db,
    logger,
    sessionPassword: env.SESSION_PASSWORD,
    secureCookies: env.SECURE_COOKIES,
    trustProxy: env.TRUST_PROXY,
    webDir: env.WEB_DIR,
    devOrigin: env.NODE_ENV === 'development' ? env.DEV_ORIGIN : undefined,
  });
  const server = app.listen(env.PORT, env.HOST, () => {
    logger.info({ url: `http://${env.HOST}:${env.PORT}` }, 'Frameside is listening');
  });
  server.on('error', (err: NodeJS.ErrnoException) => {
    logger.fatal(err.code === 'EADDRINUSE' ? `Port ${env.PORT} is already in use; set PORT to another port.` : err.message);
    process.exit(1);
  });
  const stop = () => {
    server.close(() => void db.$client.end().then(() => process.exit(0)));
    setTimeout(() => process.exit(0), 5000).unref();
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
  return server;
}

if (require.main === module) {
  start().catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
