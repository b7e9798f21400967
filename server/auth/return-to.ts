/** Accepts only a path on this site ("/projects/..."), never "//other.host" or a full URL. */
export function safeReturnTo(value: unknown, fallback = '/projects'): string {
  if (typeof value !== 'string' || value.length > 500) return fallback;
  if (!value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return fallback;
  if ([...value].some((ch) => ch.charCodeAt(0) < 0x20)) return fallback;
  return value;
}
