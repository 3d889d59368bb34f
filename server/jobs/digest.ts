import { eq, inArray } from 'drizzle-orm';
import { windowState } from '../../shared/domain/access';
import { apiaries, memberships, users } from '../../db/schema';
import type { Ctx } from '../context';
import { briefMail } from '../mail/templates';
import { dueForApiary } from '../services/due';

const DAY_MS = 86_400_000;
const day = (d: Date) => d.toISOString().slice(0, 10);
/** The digest looks one week ahead (it is sent weekly) and back a year for what is still overdue. */
const AHEAD_DAYS = 7;
const BACK_DAYS = 365;

/**
 * The weekly due digest: one e-mail per owner or keeper listing what is overdue or due in the
 * coming week across their apiaries. People with nothing due get no mail. Returns how many were sent.
 */
export async function sendDueDigests(ctx: Ctx): Promise<number> {
  const now = ctx.now();
  const rows = await ctx.db
    .select({
      userId: memberships.userId,
      email: users.email,
      name: users.name,
      apiaryId: memberships.apiaryId,
      apiaryName: apiaries.name,
      role: memberships.role,
      startsAt: memberships.startsAt,
      endsAt: memberships.endsAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .innerJoin(apiaries, eq(apiaries.id, memberships.apiaryId))
    .where(inArray(memberships.role, ['owner', 'keeper']))
    .orderBy(users.email, apiaries.name);
  const live = rows.filter((r) => windowState(r, now) === 'active');

  const from = day(new Date(now.getTime() - BACK_DAYS * DAY_MS));
  const to = day(new Date(now.getTime() + AHEAD_DAYS * DAY_MS));
  const dueByApiary = new Map<string, Awaited<ReturnType<typeof dueForApiary>>>();
  for (const id of new Set(live.map((r) => r.apiaryId))) dueByApiary.set(id, await dueForApiary(ctx, id, { from, to }));

  const byUser = new Map<string, typeof live>();
  for (const r of live) byUser.set(r.userId, [...(byUser.get(r.userId) ?? []), r]);

  let sent = 0;
  for (const list of byUser.values()) {
    const lines: string[] = [];
    for (const r of list) {
      const due = dueByApiary.get(r.apiaryId) ?? [];
      if (!due.length) continue;
      lines.push(`${r.apiaryName}:`);
      for (const t of due) lines.push(`- ${t.dueDate}${t.overdue ? ' (overdue)' : ''}: ${t.title}${t.hiveName && !t.title.includes(t.hiveName) ? ` — ${t.hiveName}` : ''}`);
      lines.push('');
    }
    if (!lines.length) continue;
    const who = list[0]!;
    await ctx.mailer.send(
      briefMail({
        to: who.email,
        subject: `Due this week in Frameside (${day(now)})`,
        lines: [`Hello ${who.name}, this is what is overdue or due by ${to}:`, '', ...lines],
        link: `${ctx.publicUrl}/`,
        linkLabel: 'Open the Due list',
      }),
    );
    sent += 1;
  }
  return sent;
}
