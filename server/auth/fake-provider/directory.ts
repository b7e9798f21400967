import { demoUsers } from '../../db/seed';

/** A person as the fake provider reports them, shaped like the provider's `GET /user` answer. */
export interface FakeAccount {
  id: string;
  login: string;
  name: string;
  email: string;
  avatar_url: string;
  html_url: string;
}

const LOGIN = /^[A-Za-z0-9](?:[A-Za-z0-9-]{0,37}[A-Za-z0-9])?$/;

/** Provider-style logins: letters, digits and inner hyphens, at most 39 characters. */
export function isValidLogin(login: string): boolean {
  return LOGIN.test(login);
}

/**
 * The fake provider's account for a login: the seeded demo users keep their seeded ids (so their
 * demo projects are theirs), any other valid login is a made-up account of its own.
 */
export function fakeAccount(login: string): FakeAccount {
  const demo = demoUsers.find((u) => u.login.toLowerCase() === login.toLowerCase());
  const name = demo?.name ?? login;
  const id = demo?.providerId ?? `fake-${login.toLowerCase()}`;
  const canonical = demo?.login ?? login;
  return {
    id,
    login: canonical,
    name,
    email: demo?.email ?? `${canonical.toLowerCase()}@fake.tapline.local`,
    avatar_url: `/fake-oauth/avatars/${encodeURIComponent(canonical)}.svg`,
    html_url: `/fake-oauth/users/${encodeURIComponent(canonical)}`,
  };
}

export function demoLogins(): string[] {
  return demoUsers.map((u) => u.login);
}
