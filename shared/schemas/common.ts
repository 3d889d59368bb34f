import { z } from 'zod';

/** An id in a URL or a body: UUIDs only, so a typo answers 404/400 rather than a database error. */
export const idSchema = z.uuid({ message: 'That id is not valid.' });

/** A free-text line a keeper might type at a desk; trimmed, bounded. */
export const shortText = (label: string, max = 120) =>
  z
    .string({ message: `${label} must be text.` })
    .trim()
    .min(1, { message: `${label} is required.` })
    .max(max, { message: `${label} must be at most ${max} characters.` });

export const optionalNote = (max = 500) =>
  z
    .string({ message: 'The note must be text.' })
    .trim()
    .max(max, { message: `The note must be at most ${max} characters.` });

/** The error body every 4xx/5xx answer carries. */
export interface ApiErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}
