import { acquireRun, type DeviceModel } from '@fixtures/device-model';

const CHUNK_BYTES = 1 << 20;
/** Longest row: a round index of up to 16 digits and `,x,y,a,b\n`. */
const LONGEST_ROW = 16 + 9;
const DIGIT_0 = 0x30;
const DIGIT_9 = 0x39;
const COMMA = 0x2c;
const NEWLINE = 0x0a;

/**
 * The CSV log of a model run (`round,x,y,a,b`, the same bytes as fixtures/model-log-file.ts
 * writes), as 1 MiB chunks made on demand, so a log of any length is never whole in memory. The
 * bytes are written directly (the round index kept as decimal digits and counted up) because
 * string formatting would make the generator four times slower.
 */
export function* modelLogChunks(model: DeviceModel, seedHex: string): Generator<Buffer> {
  let chunk = Buffer.allocUnsafe(CHUNK_BYTES);
  let at = chunk.write('round,x,y,a,b\n', 'latin1');
  const digits = new Uint8Array(16).fill(DIGIT_0);
  let firstDigit = digits.length - 1;
  let index = 0;
  for (const r of acquireRun(model, seedHex)) {
    if (at > CHUNK_BYTES - LONGEST_ROW) {
      yield chunk.subarray(0, at);
      chunk = Buffer.allocUnsafe(CHUNK_BYTES);
      at = 0;
    }
    for (; index < r.round; index++) firstDigit = Math.min(firstDigit, countUp(digits));
    for (let i = firstDigit; i < digits.length; i++) chunk[at++] = digits[i];
    chunk[at++] = COMMA;
    chunk[at++] = DIGIT_0 + r.x;
    chunk[at++] = COMMA;
    chunk[at++] = DIGIT_0 + r.y;
    chunk[at++] = COMMA;
    chunk[at++] = DIGIT_0 + r.a;
    chunk[at++] = COMMA;
    chunk[at++] = DIGIT_0 + r.b;
    chunk[at++] = NEWLINE;
  }
  if (at > 0) yield chunk.subarray(0, at);
}

/** Adds one to the decimal number in `digits` (most significant first); returns where its first digit now is. */
function countUp(digits: Uint8Array): number {
  let i = digits.length - 1;
  while (digits[i] === DIGIT_9) digits[i--] = DIGIT_0;
  digits[i] += 1;
  return i;
}
