const SHA256_HEX = /^[0-9a-f]{64}$/;

/**
 * A stored log is named by its SHA-256 alone, in lower-case hex: this check stands before every
 * path or key is made, so nothing a user typed can reach a file name or an object key.
 */
export function checkedSha256(sha256: string): string {
  if (!SHA256_HEX.test(sha256)) throw new Error(`Not a SHA-256 in lower-case hex: ${JSON.stringify(sha256.slice(0, 80))}`);
  return sha256;
}
