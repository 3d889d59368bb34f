import { auditLog } from '../../db/schema';
import type { Ctx } from '../context';

type Tx = Parameters<Parameters<Ctx['db']['transaction']>[0]>[0];

const IGNORED = new Set(['updatedAt', 'createdAt', 'version', 'updatedBy', 'passwordHash']);

const plain = (v: unknown): unknown => (v instanceof Date ? v.toISOString() : v);

/** { field: [before, after] } for the fields an edit changed. */
export function diff(before: Record<string, unknown>, after: Record<string, unknown>): Record<string, [unknown, unknown]> {
  const out: Record<string, [unknown, unknown]> = {};
  for (const key of new Set([...Object.keys(before), ...Object.keys(after)])) {
    if (IGNORED.has(key)) continue;
    const a = plain(before[key]);
    const b = plain(after[key]);
    if (JSON.stringify(a) !== JSON.stringify(b)) out[key] = [a, b];
  }
  return out;
}

export interface AuditEntry {
  apiaryId: string | null;
  userId: string;
  entity: string;
  entityId: string;
  action: 'create' | 'update' | 'delete';
  before?: Record<string, unknown>;
  after?: Record<string, unknown>;
}

/**
 * Writes one audit row inside the caller's transaction, so the trail and the change stand or
 * fall together. Call it from every service that creates, edits or deletes a record.
 */
export async function recordAudit(tx: Tx | Ctx['db'], ctx: Ctx, e: AuditEntry): Promise<void> {
  const changes =
    e.action === 'update'
      ? diff(e.before ?? {}, e.after ?? {})
      : Object.fromEntries(Object.entries((e.action === 'create' ? e.after : e.before) ?? {}).filter(([k]) => !IGNORED.has(k)).map(([k, v]) => [k, plain(v)]));
  await tx.insert(auditLog).values({
    apiaryId: e.apiaryId,
    userId: e.userId,
    entity: e.entity,
    entityId: e.entityId,
    action: e.action,
    changes,
    at: ctx.now(),
  });
}
