/**
 * The sitter's Handover brief: the hives with their last state, what falls due in the sitter's
 * window, the cautions that apply, and how to reach the owner. The same brief is e-mailed to a
 * sitter when they accept an invitation.
 */
import { and, asc, desc, eq, gte, isNull, lte, or } from 'drizzle-orm';
import { CAUTIONS, type CautionId } from '../../shared/domain/cautions';
import type { HandoverDto, HandoverHiveDto } from '../../shared/schemas/people';
import { apiaries, hives, inspections, memberships, treatments, users } from '../../db/schema';
import type { Ctx, SessionUser } from '../context';
import { briefMail } from '../mail/templates';
import { findMembership, requireApiary } from './access';
import { dueForApiary } from './due';

const DAY_MS = 86_400_000;
const day = (d: Date) => d.toISOString().slice(0, 10);
/** With no sitter booked, the owner's preview covers the coming fortnight (a typical absence; Frameside's own choice). */
const PREVIEW_DAYS = 14;
const ACIDS = new Set(['oxalic-acid', 'formic-acid']);

/** The days the brief covers for this reader. */
async function windowFor(ctx: Ctx, user: SessionUser, apiaryId: string): Promise<{ from: Date; to: Date; sitterId: string | null }> {
  const now = ctx.now();
  const mine = await findMembership(ctx, user.id, apiaryId);
  if (mine?.role === 'sitter' && mine.startsAt && mine.endsAt) {
    return { from: mine.startsAt > now ? mine.startsAt : now, to: mine.endsAt, sitterId: user.id };
  }
  // For the owner or a keeper: the current or next sitting, so they read what the sitter will read.
  const [next] = await ctx.db
    .select({ userId: memberships.userId, startsAt: memberships.startsAt, endsAt: memberships.endsAt })
    .from(memberships)
    .where(and(eq(memberships.apiaryId, apiaryId), eq(memberships.role, 'sitter'), gte(memberships.endsAt, now)))
    .orderBy(asc(memberships.startsAt))
    .limit(1);
  if (next?.startsAt && next.endsAt) return { from: next.startsAt > now ? next.startsAt : now, to: next.endsAt, sitterId: next.userId };
  return { from: now, to: new Date(now.getTime() + PREVIEW_DAYS * DAY_MS), sitterId: null };
}

/** Builds the brief without an access check; callers check (the route, the acceptance e-mail). */
export async function buildHandover(ctx: Ctx, apiaryId: string, window: { from: Date; to: Date; sitterId: string | null }): Promise<HandoverDto> {
  const now = ctx.now();
  const [apiary] = await ctx.db.select().from(apiaries).where(eq(apiaries.id, apiaryId));
  const hiveRows = await ctx.db
    .select({ id: hives.id, name: hives.name, status: hives.status, boxes: hives.boxes })
    .from(hives)
    .where(eq(hives.apiaryId, apiaryId))
    .orderBy(hives.name);
  const active = hiveRows.filter((h) => h.status === 'active');

  // The newest Quick check per hive, in one query.
  const last = await ctx.db
    .selectDistinctOn([inspections.hiveId], { i: inspections, by: users.name })
    .from(inspections)
    .innerJoin(hives, eq(hives.id, inspections.hiveId))
    .leftJoin(users, eq(users.id, inspections.createdBy))
    .where(and(eq(hives.apiaryId, apiaryId), lte(inspections.occurredAt, now)))
    .orderBy(inspections.hiveId, desc(inspections.occurredAt));
  const lastByHive = new Map(last.map((r) => [r.i.hiveId, r]));

  const hivesOut: HandoverHiveDto[] = active.map((h) => {
    const l = lastByHive.get(h.id);
    return {
      id: h.id,
      name: h.name,
      status: h.status,
      boxes: h.boxes.length,
      lastCheck: l
        ? {
            occurredAt: l.i.occurredAt.toISOString(),
            framesBrood: l.i.framesBrood,
            framesBees: l.i.framesBees,
            honeyFrames: l.i.honeyFrames,
            queenStatus: l.i.queenStatus,
            eggsSeen: l.i.eggsSeen,
            temperament: l.i.temperament,
            diseaseSigns: l.i.diseaseSigns,
            note: l.i.note,
            by: l.by ?? null,
          }
        : null,
    };
  });

  // Tasks already overdue are still waiting for someone: a year back catches them.
  const overdueFrom = day(new Date(window.from.getTime() - 365 * DAY_MS));
  const due = (await dueForApiary(ctx, apiaryId, { from: overdueFrom, to: day(window.to) })).map((t) => ({
    key: t.key,
    title: t.title,
    dueDate: t.dueDate,
    hiveId: t.hiveId,
    hiveName: t.hiveName,
    detail: t.reason,
    overdue: t.overdue,
  }));

  // Cautions: stings and robbing always apply to a sitter at the hives and feeding; foulbrood when
  // a last check noted it; acid and supers cautions while a treatment is on.
  const ids: CautionId[] = [];
  if (hivesOut.some((h) => h.lastCheck?.diseaseSigns.includes('suspected-foulbrood'))) ids.push('notifiable-disease');
  ids.push('stings', 'robbing');
  const today = day(now);
  const onTreatment = await ctx.db
    .select({ ai: treatments.activeIngredient })
    .from(treatments)
    .innerJoin(hives, eq(hives.id, treatments.hiveId))
    .where(
      and(
        eq(hives.apiaryId, apiaryId),
        lte(treatments.startDate, day(window.to)),
        isNull(treatments.actualEndDate),
        or(isNull(treatments.plannedEndDate), gte(treatments.plannedEndDate, today)),
      ),
    );
  if (onTreatment.some((t) => ACIDS.has(t.ai))) ids.push('acid-treatment');
  if (onTreatment.length) ids.push('treatment-supers');
  const cautions = ids.map((id) => ({ ...CAUTIONS[id], lines: [...CAUTIONS[id].lines] }));

  const owners = await ctx.db
    .select({ name: users.name, email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.apiaryId, apiaryId), eq(memberships.role, 'owner')))
    .orderBy(users.name);
  const [sitter] = window.sitterId
    ? await ctx.db.select({ name: users.name, email: users.email }).from(users).where(eq(users.id, window.sitterId))
    : [];

  return {
    apiary: { id: apiary!.id, name: apiary!.name, climateNote: apiary!.climateNote },
    window: { from: day(window.from), to: day(window.to) },
    sitter: sitter ?? null,
    hives: hivesOut,
    due,
    cautions,
    owners,
    generatedAt: now.toISOString(),
  };
}

/** GET /api/apiaries/:apiaryId/handover: owner, keeper, and a sitter inside the window. */
export async function getHandover(ctx: Ctx, user: SessionUser, apiaryId: string): Promise<HandoverDto> {
  await requireApiary(ctx, user, apiaryId, 'handover:read');
  return buildHandover(ctx, apiaryId, await windowFor(ctx, user, apiaryId));
}

/** The brief as a plain-text e-mail, sent to a sitter who has just accepted. */
export async function sendHandoverMail(ctx: Ctx, user: SessionUser, apiaryId: string): Promise<void> {
  const h = await buildHandover(ctx, apiaryId, await windowFor(ctx, user, apiaryId));
  const lines: string[] = [
    `Handover brief for ${h.apiary.name}, ${h.window.from} to ${h.window.to}.`,
    '',
    'Hives and their last check:',
    ...h.hives.map((v) =>
      v.lastCheck
        ? `- ${v.name}: ${v.lastCheck.framesBrood} frames of brood, ${v.lastCheck.framesBees} of bees, checked ${v.lastCheck.occurredAt.slice(0, 10)}${v.lastCheck.note ? ` (${v.lastCheck.note})` : ''}`
        : `- ${v.name}: no check recorded yet`,
    ),
    '',
    h.due.length ? 'Due while you look after them:' : 'Nothing is due in your window.',
    ...h.due.map((t) => `- ${t.dueDate}${t.overdue ? ' (overdue)' : ''}: ${t.title}${t.hiveName && !t.title.includes(t.hiveName) ? ` — ${t.hiveName}` : ''}`),
    '',
    'Take care:',
    ...h.cautions.map((c) => `- ${c.title}: ${c.lines[0]}`),
    '',
    'Reach the owner:',
    ...h.owners.map((o) => `- ${o.name} <${o.email}>`),
  ];
  await ctx.mailer.send(
    briefMail({
      to: user.email,
      subject: `Handover brief: ${h.apiary.name}`,
      lines,
      link: `${ctx.publicUrl}/apiaries/${apiaryId}/handover`,
      linkLabel: 'The full brief (printable)',
    }),
  );
}
