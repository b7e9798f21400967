// Reading a sheet file: structure checks with messages that name the part and the field,
// then the zod schema (which fills in defaults). Never throws.
import { partSpecs, isPartType, PART_TYPES } from '../parts/specs';
import { ruleText, type ParamInfo } from '../parts/types';
import {
  DEFAULT_ILLUMINANCE_LUX,
  DEFAULT_TEMPERATURE_C,
  SHEET_FORMAT,
  SHEET_VERSION,
  SheetSchema,
  splitPinRef,
  type Sheet,
} from './schema';

export interface SheetIssue {
  /** JSON path, e.g. "parts[2].params.resistance" or "wires[0].to" */
  path: string;
  partId?: string;
  field?: string;
  message: string;
}

export interface SheetError {
  code: 'invalid_sheet';
  message: string;
  issues: SheetIssue[];
}

export type ParseSheetResult = { ok: true; sheet: Sheet } | { ok: false; error: SheetError };

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** How a value is shown inside "(got …)". */
export function describeValue(v: unknown): string {
  if (v === undefined) return 'nothing';
  if (v === null) return 'null';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : String(v);
  if (typeof v === 'string') return JSON.stringify(v.length > 40 ? v.slice(0, 40) + '…' : v);
  if (typeof v === 'boolean') return String(v);
  if (Array.isArray(v)) return 'a list';
  if (typeof v === 'object') return 'an object';
  return typeof v;
}

/** Why `value` is not acceptable for param `info`, or null when it is fine. */
export function paramProblem(info: ParamInfo, value: unknown): string | null {
  if (value === undefined) {
    if (!info.required) return null;
    if (info.kind === 'enum') return `is required: one of ${(info.enumValues ?? []).map((s) => JSON.stringify(s)).join(', ')}`;
    return `is required${info.unit ? ` (a number in ${info.unit})` : ''}`;
  }
  switch (info.kind) {
    case 'number': {
      if (typeof value !== 'number' || !Number.isFinite(value)) {
        const hint =
          typeof value === 'string'
            ? '; sheet files hold plain numbers in SI units (write 4700, not "4k7" or "4.7k")'
            : '';
        return `must be a number${info.unit ? ` in ${info.unit}` : ''} (got ${describeValue(value)})${hint}`;
      }
      const r = info.rule;
      let ok = true;
      if (r?.kind === 'positive') ok = value > 0;
      else if (r?.kind === 'nonNegative') ok = value >= 0;
      else if (r?.kind === 'range') ok = value >= r.min && value <= r.max;
      else if (r?.kind === 'above') ok = value > r.min;
      return ok ? null : `${ruleText(r)} (got ${describeValue(value)})`;
    }
    case 'boolean':
      return typeof value === 'boolean' ? null : `must be true or false (got ${describeValue(value)})`;
    case 'enum':
      return typeof value === 'string' && info.enumValues?.includes(value)
        ? null
        : `must be one of ${(info.enumValues ?? []).map((s) => JSON.stringify(s)).join(', ')} (got ${describeValue(value)})`;
    case 'string':
      return typeof value === 'string' && value.trim().length > 0
        ? null
        : `must be a non-empty string (got ${describeValue(value)})`;
    case 'coefficients': {
      if (!isObject(value)) return `must be an object {"a": …, "b": …, "c": …} (got ${describeValue(value)})`;
      for (const k of ['a', 'b', 'c']) {
        const c = value[k];
        if (typeof c !== 'number' || !Number.isFinite(c)) return `needs a number "${k}" (got ${describeValue(c)})`;
      }
      return null;
    }
    default:
      return null;
  }
}

const MAX_ISSUES = 50;

/**
 * Validate a sheet. On success the sheet has every defaulted param filled in.
 * On failure, `error.issues` lists each problem with the part id and field it concerns.
 */
export function parseSheet(input: unknown): ParseSheetResult {
  const issues: SheetIssue[] = [];
  const add = (issue: SheetIssue) => {
    if (issues.length < MAX_ISSUES) issues.push(issue);
  };

  try {
    if (!isObject(input)) {
      add({ path: '', message: `A sheet must be a JSON object (got ${describeValue(input)}).` });
      return fail(issues);
    }
    if (input.format !== SHEET_FORMAT)
      add({
        path: 'format',
        field: 'format',
        message: `Sheet: field "format" must be "${SHEET_FORMAT}" (got ${describeValue(input.format)}); is this a Tapline sheet file?`,
      });
    if (input.version !== SHEET_VERSION)
      add({
        path: 'version',
        field: 'version',
        message: `Sheet: field "version" must be ${SHEET_VERSION} (got ${describeValue(input.version)}); this version of Tapline reads version 1 sheets.`,
      });
    for (const f of ['title', 'description'] as const)
      if (input[f] !== undefined && typeof input[f] !== 'string')
        add({ path: f, field: f, message: `Sheet: field "${f}" must be a string (got ${describeValue(input[f])}).` });

    if (input.conditions !== undefined) {
      if (!isObject(input.conditions))
        add({ path: 'conditions', field: 'conditions', message: `Sheet: field "conditions" must be an object (got ${describeValue(input.conditions)}).` });
      else {
        const t = input.conditions.temperatureC;
        if (t !== undefined && !(typeof t === 'number' && Number.isFinite(t) && t > -273.15))
          add({
            path: 'conditions.temperatureC',
            field: 'conditions.temperatureC',
            message: `Sheet: field "conditions.temperatureC" must be a number of °C above −273.15 (got ${describeValue(t)}; default ${DEFAULT_TEMPERATURE_C}).`,
          });
        const e = input.conditions.illuminanceLux;
        if (e !== undefined && !(typeof e === 'number' && Number.isFinite(e) && e >= 0))
          add({
            path: 'conditions.illuminanceLux',
            field: 'conditions.illuminanceLux',
            message: `Sheet: field "conditions.illuminanceLux" must be zero or a positive number of lux (got ${describeValue(e)}; default ${DEFAULT_ILLUMINANCE_LUX}).`,
          });
      }
    }

    // ---- parts
    const pinsById = new Map<string, readonly string[]>();
    const typeById = new Map<string, string>();
    const firstIndexById = new Map<string, number>();
    const parts = input.parts;
    if (parts !== undefined && !Array.isArray(parts))
      add({ path: 'parts', field: 'parts', message: `Sheet: field "parts" must be a list (got ${describeValue(parts)}).` });
    if (Array.isArray(parts)) {
      parts.forEach((raw, i) => {
        const path = `parts[${i}]`;
        if (!isObject(raw)) {
          add({ path, message: `Part #${i + 1} must be an object (got ${describeValue(raw)}).` });
          return;
        }
        const idOk = typeof raw.id === 'string' && /^[^\s.]+$/.test(raw.id);
        const typeName = typeof raw.type === 'string' ? raw.type : undefined;
        const who = idOk
          ? `Part "${raw.id as string}"${typeName && isPartType(typeName) ? ` (${typeName})` : ''}`
          : `Part #${i + 1}${typeName && isPartType(typeName) ? ` (${typeName})` : ''}`;
        const partId = idOk ? (raw.id as string) : undefined;
        if (!idOk)
          add({
            path: `${path}.id`,
            field: 'id',
            message: `${who}: field "id" must be a non-empty string without spaces or "." (got ${describeValue(raw.id)}), e.g. "R1".`,
          });
        else {
          const prev = firstIndexById.get(raw.id as string);
          if (prev !== undefined)
            add({
              path: `${path}.id`,
              partId,
              field: 'id',
              message: `Part "${raw.id as string}": the id is used by more than one part (parts #${prev + 1} and #${i + 1}); ids must be unique.`,
            });
          else firstIndexById.set(raw.id as string, i);
        }
        if (!typeName || !isPartType(typeName)) {
          add({
            path: `${path}.type`,
            ...(partId ? { partId } : {}),
            field: 'type',
            message: `${who}: field "type" must be one of ${PART_TYPES.join(', ')} (got ${describeValue(raw.type)}).`,
          });
          return;
        }
        const spec = partSpecs[typeName];
        if (partId && !pinsById.has(partId)) {
          pinsById.set(partId, spec.pins.map((p) => p.name));
          typeById.set(partId, typeName);
        }
        if (raw.position !== undefined) {
          const p = raw.position;
          if (!isObject(p) || typeof p.x !== 'number' || typeof p.y !== 'number' || !Number.isFinite(p.x) || !Number.isFinite(p.y))
            add({ path: `${path}.position`, ...(partId ? { partId } : {}), field: 'position', message: `${who}: field "position" must be {"x": number, "y": number} (got ${describeValue(p)}).` });
        }
        if (raw.rotation !== undefined && ![0, 90, 180, 270].includes(raw.rotation as number))
          add({ path: `${path}.rotation`, ...(partId ? { partId } : {}), field: 'rotation', message: `${who}: field "rotation" must be 0, 90, 180 or 270 (got ${describeValue(raw.rotation)}).` });
        if (raw.label !== undefined && typeof raw.label !== 'string')
          add({ path: `${path}.label`, ...(partId ? { partId } : {}), field: 'label', message: `${who}: field "label" must be a string (got ${describeValue(raw.label)}).` });

        let params: Record<string, unknown> = {};
        if (raw.params !== undefined) {
          if (!isObject(raw.params)) {
            add({ path: `${path}.params`, ...(partId ? { partId } : {}), field: 'params', message: `${who}: field "params" must be an object (got ${describeValue(raw.params)}).` });
            return;
          }
          params = raw.params;
        }
        let paramOk = true;
        for (const info of spec.params) {
          const problem = paramProblem(info, params[info.name]);
          if (problem) {
            paramOk = false;
            add({
              path: `${path}.params.${info.name}`,
              ...(partId ? { partId } : {}),
              field: info.name,
              message: `${who}: field "${info.name}" ${problem}.`,
            });
          }
        }
        if (paramOk && spec.crossCheck) {
          const withDefaults = { ...spec.defaults, ...params };
          for (const [field, msg] of spec.crossCheck(withDefaults))
            add({ path: `${path}.params.${field}`, ...(partId ? { partId } : {}), field, message: `${who}: field "${field}" ${msg}.` });
        }
      });
    }

    // ---- wires
    const wires = input.wires;
    if (wires !== undefined && !Array.isArray(wires))
      add({ path: 'wires', field: 'wires', message: `Sheet: field "wires" must be a list (got ${describeValue(wires)}).` });
    if (Array.isArray(wires)) {
      wires.forEach((w, i) => {
        const path = `wires[${i}]`;
        if (!isObject(w)) {
          add({ path, message: `Wire #${i + 1} must be an object {"from": "R1.a", "to": "V1.pos"} (got ${describeValue(w)}).` });
          return;
        }
        for (const end of ['from', 'to'] as const) {
          const ref = w[end];
          const where = `Wire #${i + 1}${typeof w.from === 'string' && typeof w.to === 'string' ? ` (${w.from} → ${w.to})` : ''}`;
          if (typeof ref !== 'string') {
            add({ path: `${path}.${end}`, field: end, message: `${where}: field "${end}" must be a pin written PARTID.PIN, e.g. "R1.a" (got ${describeValue(ref)}).` });
            continue;
          }
          const split = splitPinRef(ref);
          if (!split) {
            add({ path: `${path}.${end}`, field: end, message: `${where}: field "${end}" must be a pin written PARTID.PIN, e.g. "R1.a" (got ${describeValue(ref)}).` });
            continue;
          }
          const [pid, pin] = split;
          const pins = pinsById.get(pid);
          if (!pins) {
            if (!firstIndexById.has(pid))
              add({ path: `${path}.${end}`, partId: pid, field: end, message: `${where}: field "${end}" refers to part "${pid}", which is not on the sheet.` });
            continue;
          }
          if (!pins.includes(pin))
            add({
              path: `${path}.${end}`,
              partId: pid,
              field: end,
              message: `${where}: field "${end}" refers to pin "${pin}" of part "${pid}", but a ${typeById.get(pid)} has pins ${pins.map((p) => `"${p}"`).join(', ')}.`,
            });
        }
      });
    }

    if (issues.length) return fail(issues);

    const parsed = SheetSchema.safeParse(input);
    if (!parsed.success) {
      // Should not happen (the checks above mirror the schema), but never lose an error.
      for (const iss of parsed.error.issues) {
        const path = iss.path.map((p) => (typeof p === 'number' ? `[${p}]` : `.${String(p)}`)).join('').replace(/^\./, '');
        add({ path, message: `Sheet: ${path || 'file'}: ${iss.message}.` });
      }
      return fail(issues);
    }
    return { ok: true, sheet: parsed.data as Sheet };
  } catch (e) {
    add({ path: '', message: `The sheet could not be read: ${e instanceof Error ? e.message : String(e)}.` });
    return fail(issues);
  }
}

function fail(issues: SheetIssue[]): { ok: false; error: SheetError } {
  const first = issues[0]?.message ?? 'The sheet is not valid.';
  const message = issues.length > 1 ? `${first.replace(/\.$/, '')} (and ${issues.length - 1} more problem${issues.length > 2 ? 's' : ''})` : first;
  return { ok: false, error: { code: 'invalid_sheet', message, issues } };
}

/** Parse JSON text and validate it as a sheet. */
export function parseSheetJson(text: string): ParseSheetResult {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (e) {
    const msg = e instanceof Error ? e.message : String(e);
    return fail([{ path: '', message: `The file is not valid JSON: ${msg}.` }]);
  }
  return parseSheet(data);
}
