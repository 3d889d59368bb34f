import { hiveCreateSchema, hiveUpdateSchema } from '../../shared/schemas/hives';
import { userOf } from '../middleware/session';
import { body } from '../middleware/validate';
import * as hives from '../services/hives';
import { idParam, type RouteFactory } from './route';

export const hiveRoutes: RouteFactory = (ctx) => [
  {
    method: 'get',
    path: '/api/apiaries/:apiaryId/hives',
    auth: true,
    handler: async (req, res) => {
      res.json({ hives: await hives.listHives(ctx, userOf(req), idParam(req, 'apiaryId')) });
    },
  },
  {
    method: 'post',
    path: '/api/apiaries/:apiaryId/hives',
    auth: true,
    handler: async (req, res) => {
      const apiaryId = idParam(req, 'apiaryId');
      res.status(201).json({ hive: await hives.createHive(ctx, userOf(req), apiaryId, body(req, hiveCreateSchema)) });
    },
  },
  {
    method: 'get',
    path: '/api/hives/:hiveId',
    auth: true,
    handler: async (req, res) => {
      res.json({ hive: await hives.getHive(ctx, userOf(req), idParam(req, 'hiveId')) });
    },
  },
  {
    method: 'patch',
    path: '/api/hives/:hiveId',
    auth: true,
    handler: async (req, res) => {
      const hiveId = idParam(req, 'hiveId');
      res.json({ hive: await hives.updateHive(ctx, userOf(req), hiveId, body(req, hiveUpdateSchema)) });
    },
  },
];
