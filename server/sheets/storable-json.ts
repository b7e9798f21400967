// What PostgreSQL's jsonb (and JSON.stringify) cannot keep, found before a sheet reaches them:
// a \u0000 in a string (jsonb refuses it), a lone UTF-16 surrogate (not valid Unicode text; jsonb
// refuses its escape), a number JSON cannot write (1e999 parses to Infinity and would be saved as
// null), and nesting deep enough to overflow JSON.stringify's recursion. Each would otherwise be a
// 500 from the database or a sheet silently saved differently from what was sent.

/** Deepest nesting a stored document may have; a sheet file needs 5 (parts[i].params.coefficients.a). */
export const MAX_JSON_DEPTH = 32;

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

export interface StorableProblem {
  /** JSON path, e.g. "parts[1].label" */
  path: string;
  message: string;
}

/** Why a string cannot be stored as text, or null. */
export function textProblem(s: string): string | null {
  if (s.includes('\u0000')) return 'contains a NUL character (\\u0000), which cannot be stored';
  if (LONE_SURROGATE.test(s)) return 'contains a lone UTF-16 surrogate (broken Unicode text)';
  return null;
}

const join = (path: string, key: string | number) => (typeof key === 'number' ? `${path}[${key}]` : path ? `${path}.${key}` : key);

/**
 * The first value in `root` that cannot be stored verbatim as jsonb, or null when all can.
 * Iterative (an explicit stack), so a hostile 100 000-level document cannot overflow it.
 */
export function findUnstorable(root: unknown): StorableProblem | null {
  const stack: { value: unknown; path: string; depth: number }[] = [{ value: root, path: '', depth: 0 }];
  while (stack.length) {
    const { value, path, depth } = stack.pop()!;
    const where = path || 'the document';
    if (typeof value === 'string') {
      const p = textProblem(value);
      if (p) return { path, message: `${where} ${p}.` };
    } else if (typeof value === 'number') {
      if (!Number.isFinite(value)) return { path, message: `${where} is a number too large to store (got ${value}).` };
    } else if (ArrayBuffer.isView(value) || value instanceof ArrayBuffer) {
      // Binary data (a socket message can carry it) is never JSON; not walked byte by byte.
      return { path, message: `${where} is binary data, which a sheet cannot hold.` };
    } else if (value !== null && typeof value === 'object') {
      if (depth >= MAX_JSON_DEPTH) return { path, message: `${where} is nested more than ${MAX_JSON_DEPTH} levels deep; a sheet needs far fewer.` };
      const entries: [string | number, unknown][] = Array.isArray(value) ? value.map((v, i) => [i, v]) : Object.entries(value);
      for (let i = entries.length - 1; i >= 0; i--) {
        const [key, v] = entries[i];
        if (typeof key === 'string') {
          const p = textProblem(key);
          if (p) return { path, message: `A field name in ${where} ${p}.` };
        }
        stack.push({ value: v, path: join(path, key), depth: depth + 1 });
      }
    }
  }
  return null;
}
