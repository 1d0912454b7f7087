import { createHash } from 'node:crypto';
import { canonicalJson } from '../canonical-json';
import { AnalysisResult, UnsealedResult } from '../result';

/**
 * Seals a result with its fingerprint: SHA-256 (FIPS 180-4) of the canonical JSON of everything
 * else. Node-side, since the browser has SHA-256 only asynchronously (WebCrypto `subtle.digest`),
 * where the same canonical text gives the same digest.
 */
export function sealResult(result: UnsealedResult): AnalysisResult {
  const fingerprint = createHash('sha256').update(canonicalJson(result)).digest('hex');
  return { ...result, fingerprint };
}
