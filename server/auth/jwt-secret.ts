import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

/**
 * The token-signing secret: from the environment when given, else generated once and kept in the
 * data folder (mode 600), so tokens survive a restart and the secret is never committed.
 */
export function resolveJwtSecret(fromEnvironment: string | undefined, dataDir: string): string {
  if (fromEnvironment) return fromEnvironment;
  const file = path.join(dataDir, 'secrets', 'jwt-secret');
  if (fs.existsSync(file)) return fs.readFileSync(file, 'utf8').trim();
  fs.mkdirSync(path.dirname(file), { recursive: true, mode: 0o700 });
  const secret = crypto.randomBytes(48).toString('base64url');
  fs.writeFileSync(file, `${secret}\n`, { mode: 0o600, flag: 'wx' });
  return secret;
}
