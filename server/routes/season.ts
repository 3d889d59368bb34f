/**
 * The Season review.
 *
 *   GET /api/hives/:hiveId/season?season=YYYY        (hive:read)  → { season: SeasonDto }
 *   GET /api/apiaries/:apiaryId/season?season=YYYY   (hive:read)  → { season: SeasonDto }
 *
 * Without `season`, the season today falls in (calendar year north; July–June south).
 */
import { seasonQuerySchema } from '../../shared/schemas/season';
import { userOf } from '../middleware/session';
import { query } from '../middleware/validate';
import * as season from '../services/season';
import { idParam, type RouteFactory } from './route';

export const seasonRoutes: RouteFactory = (ctx) => [
  {
    method: 'get',
    path: '/api/hives/:hiveId/season',
    auth: true,
    handler: async (req, res) => {
      const hiveId = idParam(req, 'hiveId');
      res.json({ season: await season.hiveSeason(ctx, userOf(req), hiveId, query(req, seasonQuerySchema).season) });
    },
  },
  {
    method: 'get',
    path: '/api/apiaries/:apiaryId/season',
    auth: true,
    handler: async (req, res) => {
      const apiaryId = idParam(req, 'apiaryId');
      res.json({ season: await season.apiarySeason(ctx, userOf(req), apiaryId, query(req, seasonQuerySchema).season) });
    },
  },
];
