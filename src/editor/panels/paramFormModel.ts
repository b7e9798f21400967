// The property form of a part type as data: which fields, their text values, and a zod schema
// that explains bad input in words. react-hook-form runs the schema; committing a field turns
// its text back into SI values.
import { z } from 'zod';
import { partSpecs, type PartType } from '../../../shared/parts/specs';
import type { ParamInfo } from '../../../shared/parts/types';
import { formatParamValue, parseParamText } from '../format/values';

export type FormValues = Record<string, string | boolean>;

/** Params shown as fields (coefficient sets such as Steinhart–Hart are left to the file for now). */
export function formParams(type: PartType): ParamInfo[] {
  return partSpecs[type].params.filter((p) => p.kind !== 'coefficients');
}

/** Field texts for a part's current params. */
export function formValues(type: PartType, params: Record<string, unknown>): FormValues {
  const out: FormValues = {};
  for (const info of formParams(type)) {
    const v = params[info.name];
    out[info.name] = info.kind === 'boolean' ? v === true : info.kind === 'number' ? formatParamValue(info, v) : v === undefined ? '' : String(v);
  }
  return out;
}

/** The zod schema of a part type's form; its messages are what the field shows under itself. */
export function formSchema(type: PartType): z.ZodType<FormValues, FormValues> {
  const shape: Record<string, z.ZodType> = {};
  for (const info of formParams(type)) {
    if (info.kind === 'boolean') shape[info.name] = z.boolean();
    else if (info.kind === 'enum') shape[info.name] = z.enum(info.enumValues as [string, ...string[]], { error: `Choose one of ${info.enumValues?.join(', ')}.` });
    else if (info.kind === 'string') shape[info.name] = z.string().trim().min(1, `${info.label} cannot be empty.`);
    else
      shape[info.name] = z.string().superRefine((text, ctx) => {
        if (!text.trim() && !info.required) return; // empty optional: the param is left out
        const r = parseParamText(info, text);
        if (!r.ok) ctx.addIssue({ code: 'custom', message: r.message });
      });
  }
  return z.object(shape) as unknown as z.ZodType<FormValues, FormValues>;
}

export type CommitValue = { ok: true; values: Record<string, unknown> } | { ok: false; message: string };

/**
 * What committing one field writes to the part: its value in SI units (undefined removes an
 * optional param), plus the tolerance when the text carried one ("4K7J" → ±5 %).
 */
export function commitField(type: PartType, name: string, raw: string | boolean): CommitValue {
  const info = formParams(type).find((p) => p.name === name);
  if (!info) return { ok: false, message: `Unknown field ${name}.` };
  if (info.kind === 'boolean') return { ok: true, values: { [name]: raw === true } };
  const text = String(raw);
  if (info.kind === 'enum' || info.kind === 'string') {
    const t = text.trim();
    return t ? { ok: true, values: { [name]: t } } : { ok: false, message: `${info.label} cannot be empty.` };
  }
  if (!text.trim() && !info.required) return { ok: true, values: { [name]: undefined } };
  const r = parseParamText(info, text);
  if (!r.ok) return r;
  const values: Record<string, unknown> = { [name]: r.value };
  if (r.tolerance !== undefined && info.tolerance?.kind === 'fraction') values[info.tolerance.param] = r.tolerance;
  return { ok: true, values };
}
