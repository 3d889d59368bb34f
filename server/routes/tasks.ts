/**
 * The Due list and its tasks.
 *
 *   GET  /api/due?apiaryId=&hiveId=&days=  overdue tasks, then those due in the next `days` (default 14)
 *   POST /api/tasks                        add a task { apiaryId, hiveId?, title, dueDate, note? }   (task:create)
 *   POST /api/tasks/:taskId/done           mark done                                                 (task:resolve)
 *   POST /api/tasks/:taskId/snooze         snooze { until: YYYY-MM-DD }                              (task:resolve)
 *   POST /api/tasks/:taskId/dismiss        dismiss                                                   (task:resolve)
 *
 * `:taskId` is the `key` a Due-list item carries, URL-encoded (encodeURIComponent): `task:<uuid>`
 * for a task a person added, or the derived key `rule:hiveId:record` for one the rules made.
 * Who and when are taken from the session and the clock, never from the body.
 */
import { z } from 'zod';
import { dueQuerySchema, taskCreateSchema, taskSnoozeSchema } from '../../shared/schemas/tasks';
import { userOf } from '../middleware/session';
import { body, query } from '../middleware/validate';
import * as due from '../services/due';
import { notFound } from '../errors';
import type { Request } from 'express';
import type { RouteFactory } from './route';

const emptyBody = z.object({}).strict();

function taskRef(req: Request): string {
  const v = req.params.taskId;
  if (typeof v !== 'string' || v.length === 0 || v.length > 300) throw notFound('That task');
  return v;
}

export const taskRoutes: RouteFactory = (ctx) => [
  {
    method: 'get',
    path: '/api/due',
    auth: true,
    handler: async (req, res) => {
      res.json({ tasks: await due.listDue(ctx, userOf(req), query(req, dueQuerySchema)) });
    },
  },
  {
    method: 'post',
    path: '/api/tasks',
    auth: true,
    handler: async (req, res) => {
      res.status(201).json({ task: await due.createTask(ctx, userOf(req), body(req, taskCreateSchema)) });
    },
  },
  {
    method: 'post',
    path: '/api/tasks/:taskId/done',
    auth: true,
    handler: async (req, res) => {
      body(req, emptyBody);
      res.json({ task: await due.resolveTask(ctx, userOf(req), taskRef(req), { status: 'done' }) });
    },
  },
  {
    method: 'post',
    path: '/api/tasks/:taskId/snooze',
    auth: true,
    handler: async (req, res) => {
      const { until } = body(req, taskSnoozeSchema);
      res.json({ task: await due.resolveTask(ctx, userOf(req), taskRef(req), { status: 'snoozed', until }) });
    },
  },
  {
    method: 'post',
    path: '/api/tasks/:taskId/dismiss',
    auth: true,
    handler: async (req, res) => {
      body(req, emptyBody);
      res.json({ task: await due.resolveTask(ctx, userOf(req), taskRef(req), { status: 'dismissed' }) });
    },
  },
];
