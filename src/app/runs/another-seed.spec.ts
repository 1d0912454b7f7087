import { FormControl } from '@angular/forms';

import { randomSeed, seedValidator } from './another-seed';

describe('randomSeed', () => {
  it('draws 64 hex digits, a new seed each time', () => {
    const seeds = new Set(Array.from({ length: 20 }, () => randomSeed()));
    expect(seeds.size).toBe(20);
    for (const seed of seeds) expect(seed).toMatch(/^[0-9a-f]{64}$/);
  });

  it('takes its bytes from crypto.getRandomValues', () => {
    const draw = jest.spyOn(crypto, 'getRandomValues').mockImplementation(<T extends ArrayBufferView>(array: T): T => {
      new Uint8Array(array.buffer, array.byteOffset, array.byteLength).fill(0xab);
      return array;
    });
    expect(randomSeed()).toBe('ab'.repeat(32));
    draw.mockRestore();
  });
});

describe('seedValidator', () => {
  const problem = (value: string) => seedValidator(new FormControl(value, { nonNullable: true }));

  it('takes 64 hex digits in either case, with spaces around them', () => {
    expect(problem('9f2c4e81a7d35b60c8e1f4a29b7d03e56a1c8f42e7b90d35c6a2f81e4b7d09c3')).toBeNull();
    expect(problem(' 9F2C4E81A7D35B60C8E1F4A29B7D03E56A1C8F42E7B90D35C6A2F81E4B7D09C3 ')).toBeNull();
    expect(problem('')).toBeNull();
  });

  it('refuses other lengths and other letters', () => {
    expect(problem('9f2c4e81')).toEqual({ seed: true });
    expect(problem('g'.repeat(64))).toEqual({ seed: true });
    expect(problem('9f2c4e81a7d35b60c8e1f4a29b7d03e56a1c8f42e7b90d35c6a2f81e4b7d09c3a')).toEqual({ seed: true });
  });
});
