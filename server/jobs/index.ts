import PgBoss from 'pg-boss';
import type { Ctx } from '../context';
import { sendDueDigests } from './digest';

export const DUE_DIGEST_QUEUE = 'due-digest';
/** Mondays at 06:00 UTC: before a weekend keeper plans the week (Frameside's own choice). */
export const DUE_DIGEST_CRON = '0 6 * * 1';

/**
 * Scheduled work on the same PostgreSQL through pg-boss (its own `pgboss` schema). Started by
 * server/index.ts, not by createApp, so tests stay light; tests call the job functions directly.
 */
export async function startJobs(ctx: Ctx, connectionString: string): Promise<{ stop(): Promise<void> }> {
  const boss = new PgBoss({ connectionString, max: 2 });
  boss.on('error', (err) => ctx.logger.error({ err }, 'job queue error'));
  await boss.start();
  // pg-boss 10 needs the queue to exist before send, work or schedule.
  await boss.createQueue(DUE_DIGEST_QUEUE);
  await boss.schedule(DUE_DIGEST_QUEUE, DUE_DIGEST_CRON, {}, { tz: 'UTC' });
  await boss.work(DUE_DIGEST_QUEUE, async () => {
    const sent = await sendDueDigests(ctx);
    ctx.logger.info({ sent }, 'weekly due digest sent');
  });
  return { stop: () => boss.stop({ graceful: true, timeout: 5000 }) };
}
