// Telling "the database is away" apart from other failures, so that requests made while
// PostgreSQL restarts get 503 with a reason (clients retry) instead of a 500 (a bug).

// Connection-level error codes of the node socket and PostgreSQL's own for a server that is
// shutting down or starting (57P01 admin_shutdown, 57P02 crash_shutdown, 57P03 cannot_connect_now).
const CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', '57P01', '57P02', '57P03', '08000', '08003', '08006']);
// pg reports a dropped connection and a pool timeout in its messages only.
const MESSAGES = /Connection terminated|connection timeout|timeout exceeded when trying to connect|Client has encountered a connection error|the database system is (starting up|shutting down|in recovery mode)/i;

/** True when `err` (or what it wraps, e.g. a DrizzleQueryError's cause) says the database is unreachable. */
export function isDatabaseUnavailable(err: unknown): boolean {
  for (let e = err, depth = 0; e && typeof e === 'object' && depth < 4; e = (e as { cause?: unknown }).cause, depth++) {
    const { code, message } = e as { code?: unknown; message?: unknown };
    if (typeof code === 'string' && CODES.has(code)) return true;
    if (typeof message === 'string' && MESSAGES.test(message)) return true;
  }
  return false;
}
