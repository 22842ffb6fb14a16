// Parse a request part with a shared zod schema; a failure becomes a 400 naming the field.
import type { Request } from 'express';
import type { z } from 'zod';
import { validationError } from './errors';

export function parseBody<S extends z.ZodType>(schema: S, req: Request): z.infer<S> {
  const r = schema.safeParse(req.body ?? {});
  if (!r.success) throw validationError(r.error, 'body');
  return r.data;
}

export function parseQuery<S extends z.ZodType>(schema: S, req: Request): z.infer<S> {
  const r = schema.safeParse(req.query);
  if (!r.success) throw validationError(r.error, 'query');
  return r.data;
}
