import { z } from 'zod';
import { seasonQuerySchema } from './season';

export const EXPORT_FORMAT = 'frameside-export' as const;
export const EXPORT_VERSION = 1 as const;

/** The outside of an account export; each table's rows are checked against its columns on import. */
export const exportEnvelopeSchema = z.object({
  format: z.literal(EXPORT_FORMAT, { message: 'format must be "frameside-export"' }),
  version: z.literal(EXPORT_VERSION, { message: 'only version 1 exports can be imported' }),
  exportedAt: z.iso.datetime({ offset: true }),
  account: z.object({ id: z.uuid(), email: z.string().min(3).max(254), name: z.string().max(200) }),
  notes: z.array(z.string()).optional(),
  users: z.array(z.object({ id: z.uuid(), email: z.string().min(3).max(254), name: z.string().max(200) })).max(10_000),
  tables: z.record(z.string(), z.array(z.record(z.string(), z.unknown()))),
});

export interface ImportResult {
  /** Rows written per table. */
  imported: Record<string, number>;
  /** What could not come across, in plain words. */
  skipped: string[];
  /** Old id → new id, for every row and person the import mapped. */
  ids: Record<string, string>;
}

export const exportSeasonQuerySchema = seasonQuerySchema;
