import { createHash } from 'node:crypto';
import { canonicalJson } from '../canonical-json';
import { AnalysisResult, UnsealedResult } from '../result';

/**
 * Seals a result with its fingerprint: SHA-256 (FIPS 180-4) of the canonical JSON of everything
 * else. Node-side, since the browser has SHA-256 only asynchronously (WebCrypto `subtle.digest`),
 * where the same canonical text gives the same digest.
 */
export function sealResult(result: UnsealedResult): AnalysisResult {
  return { ...result, fingerprint: resultFingerprint(result) };
}

/** The fingerprint of a result's content; a sealed result's own `fingerprint` field is left out. */
export function resultFingerprint(result: UnsealedResult | AnalysisResult): string {
  const { fingerprint: _sealed, ...content } = result as AnalysisResult;
  return createHash('sha256').update(canonicalJson(content)).digest('hex');
}
