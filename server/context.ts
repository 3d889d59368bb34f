import type { Logger } from 'pino';
import type { Db } from '../db/client';

/** What every service needs: the database and the clock (tests move the clock). */
export interface Ctx {
  db: Db;
  now: () => Date;
  logger: Logger;
}

/** The signed-in person, as the session middleware puts it on the request. */
export interface SessionUser {
  id: string;
  email: string;
  name: string;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      user?: SessionUser;
      sessionId?: string;
    }
  }
}
