import jwt from 'jsonwebtoken';

/** Issuer and algorithm are pinned so a token made elsewhere, or with `alg: none`, is refused. */
export const TOKEN_ISSUER = 'bellkeep';
export const TOKEN_ALGORITHM = 'HS256';

export interface IssuedToken {
  token: string;
  expiresAt: Date;
}

/** What a token names besides its subject: the password version it was issued under. */
export interface TokenClaims {
  sub?: string;
  pv?: number;
}

/** Signs a bearer token whose subject is the user's id, under the user's current password version. */
export function issueToken(user: { id: number; passwordVersion: number }, secret: string, ttlSeconds: number): IssuedToken {
  const token = jwt.sign({ pv: user.passwordVersion }, secret, {
    algorithm: TOKEN_ALGORITHM,
    issuer: TOKEN_ISSUER,
    subject: String(user.id),
    expiresIn: ttlSeconds,
  });
  const { exp } = jwt.decode(token) as { exp: number };
  return { token, expiresAt: new Date(exp * 1000) };
}
