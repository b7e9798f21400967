import { randomBytes } from 'node:crypto';

interface CodeGrant {
  login: string;
  clientId: string;
  redirectUri: string;
  expiresAt: number;
}

const CODE_LIFETIME_MS = 10 * 60 * 1000;

/**
 * Authorization codes and access tokens of the fake provider, kept in memory per app instance:
 * codes are single-use and expire after ten minutes, as the real provider's do.
 */
export class FakeGrants {
  private codes = new Map<string, CodeGrant>();
  private tokens = new Map<string, string>();

  issueCode(login: string, clientId: string, redirectUri: string): string {
    const code = randomBytes(16).toString('hex');
    this.codes.set(code, { login, clientId, redirectUri, expiresAt: Date.now() + CODE_LIFETIME_MS });
    return code;
  }

  /** Trades a code for a token; null when the code is unknown, used, expired or for another client. */
  redeem(code: string, clientId: string, redirectUri: string | undefined): string | null {
    const grant = this.codes.get(code);
    this.codes.delete(code);
    if (!grant || grant.expiresAt < Date.now() || grant.clientId !== clientId) return null;
    if (redirectUri !== undefined && redirectUri !== grant.redirectUri) return null;
    const token = `fake_${randomBytes(20).toString('hex')}`;
    this.tokens.set(token, grant.login);
    return token;
  }

  loginForToken(token: string): string | undefined {
    return this.tokens.get(token);
  }
}
