import { randomBytes } from 'node:crypto';

/** A fresh 256-bit selection seed from the operating system's CSPRNG, as 64 lower-case hex digits. */
export function drawSeed(): string {
  return randomBytes(32).toString('hex');
}
