import { z } from 'zod';
import { textProblem } from '../sheets/storable-json';

// C0 and C1 control characters, DEL, and the Unicode line and paragraph separators.
function breaksTheLine(s: string): boolean {
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    if (c < 0x20 || (c >= 0x7f && c <= 0x9f) || c === 0x2028 || c === 0x2029) return true;
  }
  return false;
}

/** Titles are one line of plain text; the client renders them as text, never as HTML. */
export const TitleSchema = z
  .string()
  .trim()
  .min(1, 'must not be empty')
  .max(120, 'must be at most 120 characters')
  .refine((s) => !breaksTheLine(s), 'must not contain control characters or line breaks')
  .refine((s) => textProblem(s) === null, 'must be valid Unicode text (it contains a lone UTF-16 surrogate)');

/** Largest value of an `integer` column (PostgreSQL int4); a version beyond it cannot exist. */
export const MAX_INT4 = 2_147_483_647;

/** A project version a client sends back (`baseVersion`). */
export const VersionSchema = z
  .number({ error: (i) => (i.input === undefined ? 'is required: send the version you loaded' : 'must be a whole number: the version you loaded') })
  .int('must be a whole number: the version you loaded')
  .min(0, 'must be 0 or more')
  .max(MAX_INT4, 'is larger than any version: send the version you loaded');

export const CreateProjectBody = z.strictObject({
  title: TitleSchema,
  sheet: z.unknown().optional(),
});

export const PatchProjectBody = z
  .strictObject({
    title: TitleSchema.optional(),
    sheet: z.unknown().optional(),
    baseVersion: VersionSchema,
  })
  .refine((b) => b.title !== undefined || b.sheet !== undefined, { message: 'send a title or a sheet to change', path: ['title'] });
