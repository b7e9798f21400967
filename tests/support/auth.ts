import request from 'supertest';
import type { Express } from 'express';
import { expect } from 'vitest';

type Agent = ReturnType<typeof request.agent>;

/** A supertest agent with a session cookie, its CSRF token and helpers that send it. */
export interface Client {
  agent: Agent;
  /** The signed-in user (`GET /api/me`), or null for a signed-out client. */
  user: { id: number; login: string; name: string | null; email: string | null; avatarUrl: string | null } | null;
  csrf: string;
  get(path: string): request.Test;
  post(path: string): request.Test;
  patch(path: string): request.Test;
  put(path: string): request.Test;
  del(path: string): request.Test;
}

/** GET /api/csrf for the agent's session. */
export async function fetchCsrf(agent: Agent): Promise<string> {
  const res = await agent.get('/api/csrf');
  expect(res.status).toBe(200);
  return res.body.token as string;
}

function wrap(agent: Agent, user: Client['user'], csrf: string): Client {
  return {
    agent,
    user,
    csrf,
    get: (p) => agent.get(p),
    post: (p) => agent.post(p).set('X-CSRF-Token', csrf),
    patch: (p) => agent.patch(p).set('X-CSRF-Token', csrf),
    put: (p) => agent.put(p).set('X-CSRF-Token', csrf),
    del: (p) => agent.delete(p).set('X-CSRF-Token', csrf),
  };
}

/**
 * Signs in through the fake OAuth provider with plain redirects, as a script would:
 * /auth/github?login=NAME → /fake-oauth/authorize (approves at once) → /auth/github/callback.
 * Returns the Location of each hop in `hops` for tests that check the flow itself, and the
 * session cookie (`name=value`) the callback set.
 */
export async function signInAgent(agent: Agent, login: string, returnTo = '/projects'): Promise<{ hops: string[]; cookie: string }> {
  const hops: string[] = [];
  let cookie = '';
  let res = await agent.get(`/auth/github?login=${encodeURIComponent(login)}&returnTo=${encodeURIComponent(returnTo)}`);
  for (let i = 0; i < 3; i++) {
    expect(res.status, `sign-in hop ${i} for ${login}: ${res.text}`).toBe(302);
    hops.push(res.headers.location);
    const set = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('tapline.sid='));
    if (set) cookie = set.split(';')[0];
    if (i === 2) break;
    res = await agent.get(res.headers.location);
  }
  return { hops, cookie };
}

/** A fresh agent signed in as `login` (a demo login such as "ada-demo", or any valid login). */
export async function signIn(app: Express, login: string): Promise<Client> {
  const agent = request.agent(app);
  await signInAgent(agent, login);
  const me = await agent.get('/api/me');
  expect(me.status, `GET /api/me after signing in as ${login}`).toBe(200);
  return wrap(agent, me.body, await fetchCsrf(agent));
}

/** A fresh agent with a session but nobody signed in (it holds a valid CSRF token). */
export async function signedOut(app: Express): Promise<Client> {
  const agent = request.agent(app);
  return wrap(agent, null, await fetchCsrf(agent));
}
