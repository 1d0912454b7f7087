import { verdictSentence } from './verdict-sentence';

const collective = { model: 'collective' as const };
const general = { model: 'general' as const };

describe('the sentence under a verdict', () => {
  it('lets the raw key be kept when the key that counts has bits', () => {
    expect(verdictSentence({ verdict: 'ACCEPT', key: { finiteKeyBits: 41_250, generalAttackBits: null }, security: collective })).toBe(
      'Every acceptance criterion holds and no test that aborts a run failed: the raw key of this run may be kept.',
    );
  });

  it('says that no key can be extracted at this size when the key that counts is 0 bits, by the profile’s attack model', () => {
    const noKey = 'Every acceptance criterion holds and no test that aborts a run failed, but no key can be extracted from a run of this size: none is kept.';
    expect(verdictSentence({ verdict: 'ACCEPT', key: { finiteKeyBits: 0, generalAttackBits: null }, security: collective })).toBe(noKey);
    // Under the general model its own figure counts, however many bits the collective estimate gives.
    expect(verdictSentence({ verdict: 'ACCEPT', key: { finiteKeyBits: 9_000, generalAttackBits: 0 }, security: general })).toBe(noKey);
    expect(verdictSentence({ verdict: 'ACCEPT', key: { finiteKeyBits: 0, generalAttackBits: 3_100 }, security: general })).toContain('may be kept');
  });

  it('keeps no key after an abort, and calls an unreadable log no verdict at all', () => {
    expect(verdictSentence({ verdict: 'ABORT', key: null, security: null })).toBe('The run failed its tests: no key may be kept from it.');
    expect(verdictSentence({ verdict: 'INVALID', key: null, security: null })).toMatch(/^No verdict was possible: the log could not be read/);
  });

  it('says of two station logs refused for a shift that the records are shifted, not unreadable', () => {
    const shifted = verdictSentence({ verdict: 'INVALID', key: null, security: null, errorCount: 0, stations: { alignment: { shifted: true } } });
    expect(shifted).toMatch(/records are shifted against each other/);
    expect(shifted).not.toMatch(/could not be read/);
    expect(verdictSentence({ verdict: 'INVALID', key: null, security: null, errorCount: 0, stations: { alignment: { shifted: false } } })).toMatch(
      /could not be judged as they stand/,
    );
    expect(verdictSentence({ verdict: 'INVALID', key: null, security: null, errorCount: 2, stations: { alignment: null } })).toMatch(/could not be read as a round log/);
  });
});
