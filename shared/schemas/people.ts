import { z } from 'zod';
import { ROLES, type Role, type WindowState } from '../domain/access';
import { emailSchema, passwordSchema } from './auth';

const DATE_RE = /^\d{4}-\d{2}-\d{2}$/;
const DAY_MS = 86_400_000;

/**
 * A window date from the form: a calendar day 'YYYY-MM-DD' (UTC) or a full ISO timestamp.
 * A start day counts from its first moment; an end day counts to its last moment, so a sitter
 * "until 14 Aug" can still record on the 14th and the refusal names the 14th.
 */
const windowDate = (label: string) =>
  z
    .string({ message: `${label} must be a date.` })
    .refine((v) => (DATE_RE.test(v) || /^\d{4}-\d{2}-\d{2}T/.test(v)) && Number.isFinite(Date.parse(v)), {
      message: `${label} must be a date written YYYY-MM-DD.`,
    });

export function windowStart(v: string): Date {
  return new Date(DATE_RE.test(v) ? `${v}T00:00:00.000Z` : v);
}
export function windowEnd(v: string): Date {
  return DATE_RE.test(v) ? new Date(Date.parse(`${v}T00:00:00.000Z`) + DAY_MS - 1) : new Date(v);
}

/** The longest sitting Frameside accepts in one go; a longer absence is a keeper's job, not a sitter's. */
export const MAX_SITTER_DAYS = 120;

const roleSchema = z.enum(ROLES, { message: 'Choose a role: owner, keeper, sitter or viewer.' });

function checkWindow(
  v: { role?: Role; startsAt?: string | null; endsAt?: string | null },
  ctx: z.RefinementCtx,
  required: boolean,
) {
  const hasAny = v.startsAt != null || v.endsAt != null;
  if (v.role !== undefined && v.role !== 'sitter' && hasAny) {
    ctx.addIssue({ code: 'custom', path: ['startsAt'], message: 'Only a sitter has start and end dates; leave them out for this role.' });
    return;
  }
  if (required && v.role === 'sitter') {
    if (v.startsAt == null) ctx.addIssue({ code: 'custom', path: ['startsAt'], message: 'A sitter needs a start date.' });
    if (v.endsAt == null) ctx.addIssue({ code: 'custom', path: ['endsAt'], message: 'A sitter needs an end date.' });
  }
  if (v.startsAt != null && v.endsAt != null) {
    const s = windowStart(v.startsAt).getTime();
    const e = windowEnd(v.endsAt).getTime();
    if (!(e > s)) ctx.addIssue({ code: 'custom', path: ['endsAt'], message: 'The end date must be after the start date.' });
    else if (e - s > MAX_SITTER_DAYS * DAY_MS)
      ctx.addIssue({ code: 'custom', path: ['endsAt'], message: `A sitter's window can be at most ${MAX_SITTER_DAYS} days.` });
  }
}

export const invitationCreateSchema = z
  .object({
    email: emailSchema,
    role: roleSchema,
    startsAt: windowDate('The start date').nullish(),
    endsAt: windowDate('The end date').nullish(),
  })
  .strict()
  .superRefine((v, ctx) => checkWindow(v, ctx, true));
export type InvitationCreateInput = z.infer<typeof invitationCreateSchema>;

export const memberUpdateSchema = z
  .object({
    role: roleSchema.optional(),
    startsAt: windowDate('The start date').nullish(),
    endsAt: windowDate('The end date').nullish(),
  })
  .strict()
  .refine((v) => v.role !== undefined || v.startsAt !== undefined || v.endsAt !== undefined, {
    message: 'Say what to change: the role or the dates.',
  })
  .superRefine((v, ctx) => checkWindow(v, ctx, false));
export type MemberUpdateInput = z.infer<typeof memberUpdateSchema>;

/** Accepting while signed out: an existing account signs in, a new e-mail signs up. */
export const invitationAcceptSchema = z
  .object({
    email: emailSchema,
    password: z.string({ message: 'Enter a password.' }).min(1, { message: 'Enter a password.' }).max(200),
    name: z.string().trim().min(1, { message: 'Enter your name.' }).max(80, { message: 'The name must be at most 80 characters.' }).optional(),
  })
  .strict();
export type InvitationAcceptInput = z.infer<typeof invitationAcceptSchema>;

export const passwordResetRequestSchema = z.object({ email: emailSchema }).strict();
export const passwordResetSchema = z.object({ password: passwordSchema }).strict();

export interface MemberDto {
  userId: string;
  name: string;
  email: string;
  role: Role;
  startsAt: string | null;
  endsAt: string | null;
  state: WindowState;
  daysLeft: number | null;
}

export interface PendingInvitationDto {
  id: string;
  email: string;
  role: Role;
  startsAt: string | null;
  endsAt: string | null;
  expiresAt: string;
  invitedBy: string | null;
}

export interface MembersDto {
  members: MemberDto[];
  invitations: PendingInvitationDto[];
}

export interface InvitationInfoDto {
  apiaryName: string;
  role: Role;
  email: string;
  startsAt: string | null;
  endsAt: string | null;
  expiresAt: string;
  invitedBy: string | null;
  /** Whether an account with the invited e-mail exists: the page offers sign in rather than sign up. */
  accountExists: boolean;
}

export interface ActivityDto {
  id: string;
  at: string;
  who: { id: string; name: string } | null;
  entity: string;
  entityId: string;
  action: 'create' | 'update' | 'delete';
  changes: Record<string, unknown>;
}

export interface HandoverHiveDto {
  id: string;
  name: string;
  status: string;
  boxes: number;
  lastCheck: {
    occurredAt: string;
    framesBrood: number;
    framesBees: number;
    honeyFrames: number;
    queenStatus: string;
    eggsSeen: boolean;
    temperament: number | null;
    diseaseSigns: string[];
    note: string;
    by: string | null;
  } | null;
}

export interface HandoverDueDto {
  key: string;
  title: string;
  dueDate: string;
  hiveId: string | null;
  hiveName: string | null;
  detail: string;
  overdue: boolean;
}

export interface HandoverDto {
  apiary: { id: string; name: string; climateNote: string };
  /** The days the brief covers: the sitter's window (or, for the owner, the next sitting or the coming fortnight). */
  window: { from: string; to: string };
  sitter: { name: string; email: string } | null;
  hives: HandoverHiveDto[];
  due: HandoverDueDto[];
  cautions: { id: string; title: string; lines: string[]; severity: 'stop' | 'care' }[];
  owners: { name: string; email: string }[];
  generatedAt: string;
}
