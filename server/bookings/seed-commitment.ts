import crypto from 'node:crypto';

/** A fresh seed: 32 random bytes as 64 lowercase hex characters. */
export function drawSeed(): string {
  return crypto.randomBytes(32).toString('hex');
}

/**
 * The published commitment to a seed: SHA-256 of its 64 hex characters as ASCII, so anyone can
 * check a revealed seed with `printf %s <seed> | sha256sum`. The seed holds 256 random bits, so
 * the commitment hides it; SHA-256's collision resistance binds the server to it.
 */
export function seedCommitment(seed: string): string {
  return crypto.createHash('sha256').update(seed, 'ascii').digest('hex');
}
