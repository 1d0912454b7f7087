import { hexOf } from './hex';

/**
 * SHA-256 of `text` as UTF-8 (for ASCII text, its bytes as they are), in lowercase hex, computed by
 * the browser's Web Crypto.
 *
 * @example await sha256Hex('abc') // 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'
 */
export async function sha256Hex(text: string): Promise<string> {
  return hexOf(new Uint8Array(await crypto.subtle.digest('SHA-256', new TextEncoder().encode(text))));
}
