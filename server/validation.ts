import type { z } from 'zod';
import { HttpError } from './http-errors';

/** Parses a request part with a zod schema; a mismatch becomes 400 naming the first bad field. */
export function parseWith<S extends z.ZodType>(schema: S, data: unknown, what = 'request body'): z.infer<S> {
  const r = schema.safeParse(data ?? {});
  if (r.success) return r.data;
  const issue = r.error.issues[0];
  // An unknown field is named itself, so the caller sees which one to drop.
  if (issue.code === 'unrecognized_keys') {
    const field = [...issue.path.map(String), String(issue.keys[0]).slice(0, 64)].join('.');
    throw new HttpError(400, 'invalid_request', `Field "${field}" of the ${what} is not one this route takes; leave it out.`, field);
  }
  const field = issue.path.map(String).join('.');
  const message = field ? `Field "${field}" of the ${what}: ${issue.message}.` : `The ${what} is not valid: ${issue.message}.`;
  throw new HttpError(400, 'invalid_request', message, field || undefined);
}
