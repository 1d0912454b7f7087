import crypto, { type KeyObject } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

/** The key this process signs results with. */
export interface SigningKey {
  keyId: string;
  publicKeyPem: string;
  privateKey: KeyObject;
}

/** Where a generated key is kept, under the data folder. */
export function signingKeyFile(dataDir: string): string {
  return path.join(dataDir, 'secrets', 'signing-key.pem');
}

/**
 * The Ed25519 signing key (RFC 8032): from the environment when given, else generated once and kept
 * in the data folder (mode 600), like the token secret. A process given another key rotates it
 * (see `registerSigningKey`).
 */
export function resolveSigningKey(fromEnvironment: string | undefined, dataDir: string): SigningKey {
  const file = signingKeyFile(dataDir);
  let pem = fromEnvironment;
  if (!pem && fs.existsSync(file)) pem = fs.readFileSync(file, 'utf8');
  if (!pem) {
    pem = crypto.generateKeyPairSync('ed25519').privateKey.export({ format: 'pem', type: 'pkcs8' }).toString();
    fs.mkdirSync(path.dirname(file), { recursive: true, mode: 0o700 });
    fs.writeFileSync(file, pem, { mode: 0o600, flag: 'wx' });
  }
  return signingKeyFromPem(pem);
}

/** A signing key from its PKCS#8 PEM; anything but Ed25519 is refused with the reason. */
export function signingKeyFromPem(pem: string): SigningKey {
  const privateKey = crypto.createPrivateKey(pem);
  if (privateKey.asymmetricKeyType !== 'ed25519') {
    throw new Error(`The signing key must be Ed25519; this one is ${privateKey.asymmetricKeyType ?? 'not an asymmetric key'}.`);
  }
  const publicKey = crypto.createPublicKey(privateKey);
  return { keyId: signingKeyId(publicKey), publicKeyPem: publicKey.export({ format: 'pem', type: 'spki' }).toString(), privateKey };
}

/** A key's name: the first 16 hex digits of the SHA-256 of its raw 32 public bytes. */
export function signingKeyId(publicKey: KeyObject): string {
  const raw = Buffer.from(publicKey.export({ format: 'jwk' }).x!, 'base64url');
  return crypto.createHash('sha256').update(raw).digest('hex').slice(0, 16);
}
