import type { Logger } from 'pino';
import type { Db } from '../db/client';
import type { Mailer } from './mail/mailer';
import type { ObjectStorage } from './storage';

/** What every service needs: the database and the clock (tests move the clock). */
export interface Ctx {
  db: Db;
  now: () => Date;
  logger: Logger;
  /** Object storage for photos (a local folder under uploads/ unless another driver is passed). */
  storage: ObjectStorage;
  /** Where e-mail goes (a no-op in tests that do not read mail). */
  mailer: Mailer;
  /** The address people open, for links in e-mail (no trailing slash). */
  publicUrl: string;
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
