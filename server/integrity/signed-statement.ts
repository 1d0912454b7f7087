import crypto from 'node:crypto';
import { canonicalJson } from '@shared/analysis';
import type { ResultSignatureDto, SignedStatement } from '@shared/api';
import { signingKeyId, type SigningKey } from './signing-key';

/** Names what the signed bytes are, so a signature over them can never pass for anything else. */
export const SIGNED_STATEMENT_PREFIX = 'bellkeep signed result v1\n';

/**
 * The bytes an Ed25519 signature covers: the prefix, then the canonical JSON of the statement
 * (keys sorted, no whitespace; `canonicalJson`), in UTF-8. With the statement from a report,
 * `openssl pkeyutl -verify -rawin` checks them too.
 */
export function signedStatementBytes(statement: SignedStatement): Buffer {
  const { runId, fileSha256, fingerprint, signedAt } = statement;
  return Buffer.from(SIGNED_STATEMENT_PREFIX + canonicalJson({ runId, fileSha256, fingerprint, signedAt }), 'utf8');
}

/** Signs a statement (Ed25519 takes no separate digest: `crypto.sign(null, ...)`). */
export function signStatement(statement: SignedStatement, key: SigningKey): ResultSignatureDto {
  const signature = crypto.sign(null, signedStatementBytes(statement), key.privateKey).toString('base64');
  return { algorithm: 'Ed25519', keyId: key.keyId, statement, signature };
}

/** Why a signature does not hold with a public key, or null when it holds. */
export function signatureProblem(signature: ResultSignatureDto, publicKeyPem: string): string | null {
  let publicKey;
  try {
    publicKey = crypto.createPublicKey(publicKeyPem);
  } catch {
    return 'the public key is not a readable PEM';
  }
  if (publicKey.asymmetricKeyType !== 'ed25519') return `the public key is ${publicKey.asymmetricKeyType}, not Ed25519`;
  if (signingKeyId(publicKey) !== signature.keyId) return `the public key is ${signingKeyId(publicKey)}, not the signing key ${signature.keyId}`;
  const bytes = Buffer.from(signature.signature, 'base64');
  if (bytes.length !== 64) return `the signature is ${bytes.length} bytes long, not 64`;
  return crypto.verify(null, signedStatementBytes(signature.statement), publicKey, bytes) ? null : 'the signature does not match the signed statement';
}
