import jwt from 'jsonwebtoken';

/** Issuer and algorithm are pinned so a token made elsewhere, or with `alg: none`, is refused. */
export const TOKEN_ISSUER = 'bellkeep';
export const TOKEN_ALGORITHM = 'HS256';

export interface IssuedToken {
  token: string;
  expiresAt: Date;
}

/** Signs a bearer token whose subject is the user's id. */
export function issueToken(userId: number, secret: string, ttlSeconds: number): IssuedToken {
  const token = jwt.sign({}, secret, {
    algorithm: TOKEN_ALGORITHM,
    issuer: TOKEN_ISSUER,
    subject: String(userId),
    expiresIn: ttlSeconds,
  });
  const { exp } = jwt.decode(token) as { exp: number };
  return { token, expiresAt: new Date(exp * 1000) };
}
