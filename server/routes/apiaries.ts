import { apiaryCreateSchema, apiaryUpdateSchema } from '../../shared/schemas/apiaries';
import { userOf } from '../middleware/session';
import { body } from '../middleware/validate';
import * as apiaries from '../services/apiaries';
import { idParam, type RouteFactory } from './route';

export const apiaryRoutes: RouteFactory = (ctx) => [
  {
    method: 'get',
    path: '/api/apiaries',
    auth: true,
    handler: async (req, res) => {
      res.json({ apiaries: await apiaries.listApiaries(ctx, userOf(req)) });
    },
  },
  {
    method: 'post',
    path: '/api/apiaries',
    auth: true,
    handler: async (req, res) => {
      res.status(201).json({ apiary: await apiaries.createApiary(ctx, userOf(req), body(req, apiaryCreateSchema)) });
    },
  },
  {
    method: 'get',
    path: '/api/apiaries/:apiaryId',
    auth: true,
    handler: async (req, res) => {
      res.json({ apiary: await apiaries.getApiary(ctx, userOf(req), idParam(req, 'apiaryId')) });
    },
  },
  {
    method: 'patch',
    path: '/api/apiaries/:apiaryId',
    auth: true,
    handler: async (req, res) => {
      const apiaryId = idParam(req, 'apiaryId');
      res.json({ apiary: await apiaries.updateApiary(ctx, userOf(req), apiaryId, body(req, apiaryUpdateSchema)) });
    },
  },
];
