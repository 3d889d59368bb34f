/** GET /api/hives/:hiveId/story?season=YYYY: the hive's records for a season, oldest first. */
import { storyQuerySchema } from '../../shared/schemas/story';
import { userOf } from '../middleware/session';
import { query } from '../middleware/validate';
import { getStory } from '../services/story';
import { idParam, type RouteFactory } from './route';

export const storyRoutes: RouteFactory = (ctx) => [
  {
    method: 'get',
    path: '/api/hives/:hiveId/story',
    auth: true,
    handler: async (req, res) => {
      const hiveId = idParam(req, 'hiveId');
      res.json({ story: await getStory(ctx, userOf(req), hiveId, query(req, storyQuerySchema)) });
    },
  },
];
