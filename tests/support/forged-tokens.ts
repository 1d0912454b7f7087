import jwt from 'jsonwebtoken';
import { TOKEN_ALGORITHM, TOKEN_ISSUER } from '@server/auth/tokens';
import { TEST_JWT_SECRET } from './test-app';

/** What a forged sign-in token may get wrong; everything not given is as the server issues it. */
export interface ForgedClaims {
  /** The user id the token names. */
  subject: string;
  secret?: string;
  issuer?: string;
  /** Seconds from now; negative for a token that has expired. */
  expiresIn?: number;
}

/** A sign-in token made outside the server, with the test app's secret unless told otherwise. */
export function forgedToken({ subject, secret = TEST_JWT_SECRET, issuer = TOKEN_ISSUER, expiresIn = 3600 }: ForgedClaims): string {
  const now = Math.floor(Date.now() / 1000);
  // iat an hour back, so that a negative expiresIn still gives a token issued before it expired.
  return jwt.sign({ iat: now - 3600, exp: now + expiresIn }, secret, { algorithm: TOKEN_ALGORITHM, issuer, subject });
}

/** An unsigned token (`alg: none`, empty signature) with otherwise valid claims. */
export function unsignedToken(subject: string): string {
  const part = (value: object) => Buffer.from(JSON.stringify(value)).toString('base64url');
  const now = Math.floor(Date.now() / 1000);
  return `${part({ alg: 'none', typ: 'JWT' })}.${part({ sub: subject, iss: TOKEN_ISSUER, iat: now, exp: now + 3600 })}.`;
}
