import type { Request } from 'express';
import { Strategy as GitHubStrategy, type StrategyOptions } from 'passport-github2';
import type { VerifyCallback } from 'passport-oauth2';
import type { Profile } from 'passport';
import { usesRealOAuth, type Config } from '../config';
import type { Db } from '../db/client';
import { CALLBACK_PATH, FAKE_CLIENT } from './fake-provider/routes';
import { publicUser, upsertUserFromProfile } from './users';

export type StrategyFor = (req: Request) => GitHubStrategy;

/**
 * The loopback origin of the socket this request arrived on. The fake provider is this same
 * process, so the server-to-server calls (code for token, profile) go there; unlike the Host
 * header it cannot be steered by the client.
 */
function selfOrigin(req: Request): string {
  let addr = req.socket.localAddress ?? '127.0.0.1';
  if (addr.startsWith('::ffff:')) addr = addr.slice(7);
  if (addr === '::' || addr === '0.0.0.0') addr = '127.0.0.1';
  const host = addr.includes(':') ? `[${addr}]` : addr;
  return `http://${host}:${req.socket.localPort}`;
}

/** Adds GitHub's `login` hint to the authorize URL; the fake provider approves that login at once. */
class TaplineGitHubStrategy extends GitHubStrategy {
  override authorizationParams(options: { login?: string }): object {
    return options.login ? { login: options.login } : {};
  }
}

/** Builds the passport-github2 strategy: the hosted provider when configured, else the local fake. */
export function createStrategyFactory(config: Config, db: Db): StrategyFor {
  const verify = (_a: string, _r: string, profile: Profile, done: VerifyCallback) => {
    upsertUserFromProfile(db, profile).then((u) => done(null, publicUser(u)), (err: Error) => done(err));
  };
  const common = {
    callbackURL: config.PUBLIC_URL ? new URL(CALLBACK_PATH, config.PUBLIC_URL).toString() : CALLBACK_PATH,
    scope: ['user:email'],
    // passport-oauth2 supports state; its type definitions only allow a string here.
    state: true as unknown as string,
    sessionKey: 'oauth2:github',
  };
  if (usesRealOAuth(config)) {
    const real = new TaplineGitHubStrategy(
      { ...common, clientID: config.GITHUB_CLIENT_ID!, clientSecret: config.GITHUB_CLIENT_SECRET! } as StrategyOptions,
      verify,
    );
    return () => real;
  }
  return (req) => {
    const origin = selfOrigin(req);
    return new TaplineGitHubStrategy(
      {
        ...common,
        clientID: FAKE_CLIENT.id,
        clientSecret: FAKE_CLIENT.secret,
        // The browser follows this one, so it stays relative (works behind the dev proxy too).
        authorizationURL: '/fake-oauth/authorize',
        tokenURL: `${origin}/fake-oauth/access_token`,
        userProfileURL: `${origin}/fake-oauth/user`,
        userEmailURL: `${origin}/fake-oauth/user/emails`,
      } as StrategyOptions,
      verify,
    );
  };
}
