import type { Request } from 'express';
import type { z } from 'zod';
import { fromZod } from '../errors';

/** Parses a part of the request with a shared zod schema; a failure answers 400 with field messages. */
export function parse<S extends z.ZodType>(schema: S, value: unknown): z.infer<S> {
  const result = schema.safeParse(value);
  if (!result.success) throw fromZod(result.error);
  return result.data;
}

export const body = <S extends z.ZodType>(req: Request, schema: S): z.infer<S> => parse(schema, req.body ?? {});
export const query = <S extends z.ZodType>(req: Request, schema: S): z.infer<S> => parse(schema, req.query);
