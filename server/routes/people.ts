import { z } from 'zod';
import {
  invitationAcceptSchema,
  invitationCreateSchema,
  memberUpdateSchema,
  passwordResetRequestSchema,
  passwordResetSchema,
} from '../../shared/schemas/people';
import { readCookie, userOf } from '../middleware/session';
import { body, query } from '../middleware/validate';
import * as handover from '../services/handover';
import * as members from '../services/members';
import * as reset from '../services/password-reset';
import { idParam, type RouteFactory } from './route';

const tokenParam = (req: { params: Record<string, unknown> }) => String(req.params.token ?? '');
const activityQuery = z.object({ limit: z.coerce.number().int().min(1).max(500).default(100) });

/** Members, invitations, the Handover brief, recent activity, deleting an apiary and password resets. */
export const peopleRoutes: RouteFactory = (ctx, { signInLimiter, sessionOptions }) => [
  {
    method: 'get',
    path: '/api/apiaries/:apiaryId/members',
    auth: true,
    handler: async (req, res) => {
      res.json(await members.listMembers(ctx, userOf(req), idParam(req, 'apiaryId')));
    },
  },
  {
    method: 'patch',
    path: '/api/apiaries/:apiaryId/members/:userId',
    auth: true,
    handler: async (req, res) => {
      const apiaryId = idParam(req, 'apiaryId');
      const userId = idParam(req, 'userId');
      res.json({ member: await members.updateMember(ctx, userOf(req), apiaryId, userId, body(req, memberUpdateSchema)) });
    },
  },
  {
    method: 'delete',
    path: '/api/apiaries/:apiaryId/members/:userId',
    auth: true,
    handler: async (req, res) => {
      await members.removeMember(ctx, userOf(req), idParam(req, 'apiaryId'), idParam(req, 'userId'));
      res.status(204).end();
    },
  },
  {
    method: 'post',
    path: '/api/apiaries/:apiaryId/invitations',
    auth: true,
    handler: async (req, res) => {
      const apiaryId = idParam(req, 'apiaryId');
      res.status(201).json({ invitation: await members.createInvitation(ctx, userOf(req), apiaryId, body(req, invitationCreateSchema)) });
    },
  },
  {
    method: 'delete',
    path: '/api/apiaries/:apiaryId/invitations/:invitationId',
    auth: true,
    handler: async (req, res) => {
      await members.revokeInvitation(ctx, userOf(req), idParam(req, 'apiaryId'), idParam(req, 'invitationId'));
      res.status(204).end();
    },
  },
  {
    method: 'get',
    path: '/api/invitations/:token',
    auth: false,
    handler: async (req, res) => {
      res.json({ invitation: await members.invitationInfo(ctx, tokenParam(req)) });
    },
  },
  {
    method: 'post',
    path: '/api/invitations/:token/accept',
    auth: false,
    before: [signInLimiter],
    handler: async (req, res) => {
      const signedIn = req.user;
      const credentials = signedIn ? undefined : body(req, invitationAcceptSchema);
      const result = await members.acceptInvitation(ctx, tokenParam(req), signedIn, credentials);
      if (result.sessionId) {
        const cookie = await readCookie(req, res, sessionOptions);
        cookie.sid = result.sessionId;
        await cookie.save();
      }
      res.status(200).json({ user: result.user, apiaryId: result.apiaryId, role: result.role });
    },
  },
  {
    method: 'delete',
    path: '/api/apiaries/:apiaryId',
    auth: true,
    handler: async (req, res) => {
      await members.deleteApiary(ctx, userOf(req), idParam(req, 'apiaryId'));
      res.status(204).end();
    },
  },
  {
    method: 'get',
    path: '/api/apiaries/:apiaryId/activity',
    auth: true,
    handler: async (req, res) => {
      const { limit } = query(req, activityQuery);
      res.json({ activity: await members.listActivity(ctx, userOf(req), idParam(req, 'apiaryId'), limit) });
    },
  },
  {
    method: 'get',
    path: '/api/apiaries/:apiaryId/handover',
    auth: true,
    handler: async (req, res) => {
      res.json({ handover: await handover.getHandover(ctx, userOf(req), idParam(req, 'apiaryId')) });
    },
  },
  {
    method: 'post',
    path: '/api/auth/password-reset',
    auth: false,
    before: [signInLimiter],
    handler: async (req, res) => {
      await reset.requestPasswordReset(ctx, body(req, passwordResetRequestSchema).email);
      res.status(202).json({ message: 'If an account has that e-mail, a link to reset its password is on its way.' });
    },
  },
  {
    method: 'post',
    path: '/api/auth/password-reset/:token',
    auth: false,
    before: [signInLimiter],
    handler: async (req, res) => {
      await reset.resetPassword(ctx, tokenParam(req), body(req, passwordResetSchema).password, req.sessionId);
      res.status(204).end();
    },
  },
];
