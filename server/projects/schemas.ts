import { z } from 'zod';

/** Titles are one line of plain text; the client renders them as text, never as HTML. */
export const TitleSchema = z
  .string()
  .trim()
  .min(1, 'must not be empty')
  .max(120, 'must be at most 120 characters')
  .refine((s) => ![...s].some((ch) => ch.charCodeAt(0) < 0x20 || ch.charCodeAt(0) === 0x7f), 'must not contain control characters or line breaks');

export const CreateProjectBody = z.strictObject({
  title: TitleSchema,
  sheet: z.unknown().optional(),
});

export const PatchProjectBody = z
  .strictObject({
    title: TitleSchema.optional(),
    sheet: z.unknown().optional(),
    baseVersion: z.number({ error: 'is required: send the version you loaded' }).int().min(0),
  })
  .refine((b) => b.title !== undefined || b.sheet !== undefined, { message: 'send a title or a sheet to change', path: ['title'] });
