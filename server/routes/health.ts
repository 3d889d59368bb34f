import { sql } from 'drizzle-orm';
import type { RouteFactory } from './route';

export const healthRoutes: RouteFactory = (ctx) => [
  {
    method: 'get',
    path: '/api/health',
    auth: false,
    handler: async (_req, res) => {
      try {
        await ctx.db.execute(sql`select 1`);
        res.json({ ok: true, database: 'up' });
      } catch {
        res.status(503).json({ ok: false, database: 'down' });
      }
    },
  },
];
