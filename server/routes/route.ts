import type { Request, Response, RequestHandler } from 'express';
import type { Ctx } from '../context';
import { notFound } from '../errors';

export type Method = 'get' | 'post' | 'patch' | 'put' | 'delete';

/** One API route. Every route is declared this way so the full table can be listed (tests check each one). */
export interface RouteDef {
  method: Method;
  path: string;
  /** false only for the few routes open to signed-out visitors. */
  auth: boolean;
  /** Extra middleware before the handler (uploads, rate limits). */
  before?: RequestHandler[];
  handler: (req: Request, res: Response) => Promise<unknown> | unknown;
}

export type RouteFactory = (ctx: Ctx, deps: RouteDeps) => RouteDef[];

/** Things some routes need besides the context; set up once in createApp. */
export interface RouteDeps {
  signInLimiter: RequestHandler;
  sessionOptions: import('iron-session').SessionOptions;
}

/** Reads a UUID route parameter; anything else is a record that cannot exist (404). */
export function idParam(req: Request, name: string): string {
  const v = req.params[name];
  if (typeof v !== 'string' || !/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(v)) {
    throw notFound();
  }
  return v.toLowerCase();
}
