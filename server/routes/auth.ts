import { signInSchema, signUpSchema } from '../../shared/schemas/auth';
import { userOf, readCookie } from '../middleware/session';
import { body } from '../middleware/validate';
import * as auth from '../services/auth';
import type { RouteFactory } from './route';

export const authRoutes: RouteFactory = (ctx, { signInLimiter, sessionOptions }) => [
  {
    method: 'post',
    path: '/api/auth/sign-up',
    auth: false,
    before: [signInLimiter],
    handler: async (req, res) => {
      const { user, sessionId } = await auth.signUp(ctx, body(req, signUpSchema));
      const cookie = await readCookie(req, res, sessionOptions);
      cookie.sid = sessionId;
      await cookie.save();
      res.status(201).json({ user });
    },
  },
  {
    method: 'post',
    path: '/api/auth/sign-in',
    auth: false,
    before: [signInLimiter],
    handler: async (req, res) => {
      const { user, sessionId } = await auth.signIn(ctx, body(req, signInSchema));
      const cookie = await readCookie(req, res, sessionOptions);
      cookie.sid = sessionId;
      await cookie.save();
      res.json({ user });
    },
  },
  {
    method: 'post',
    path: '/api/auth/sign-out',
    auth: false,
    handler: async (req, res) => {
      await auth.signOut(ctx, req.sessionId);
      const cookie = await readCookie(req, res, sessionOptions);
      cookie.destroy();
      res.status(204).end();
    },
  },
  {
    method: 'get',
    path: '/api/me',
    auth: true,
    handler: async (req, res) => {
      res.json(await auth.me(ctx, userOf(req).id));
    },
  },
];
