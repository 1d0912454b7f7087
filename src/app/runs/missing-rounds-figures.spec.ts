import { missingRoundsFigures } from './missing-rounds-figures';

const THIN = '\u2009';

describe('missingRoundsFigures', () => {
  const summary = { firstRound: 0, lastRound: 1_499_999, triggers: 1_500_000, missing: 3_000, drawnForTesting: 152, tolerated: 1_500 };

  it('formats the span, the counts and the share of the triggers', () => {
    expect(missingRoundsFigures(summary)).toEqual({
      span: `0 to 1${THIN}499${THIN}999`,
      triggers: `1${THIN}500${THIN}000`,
      missing: `3${THIN}000`,
      share: `0.20${THIN}%`,
      tolerated: `1${THIN}500`,
      drawnForTesting: '152',
      overTolerance: true,
      anyMissing: true,
      word: 'Over tolerance',
      icon: 'warning',
    });
  });

  it('keeps a tiny share readable rather than 0.00 %', () => {
    expect(missingRoundsFigures({ ...summary, missing: 3 })!.share).toBe(`0.00020${THIN}%`);
    expect(missingRoundsFigures({ ...summary, missing: 0 })!.share).toBe(`0${THIN}%`);
  });

  it('is over tolerance only when more are missing than tolerated', () => {
    expect(missingRoundsFigures({ ...summary, missing: 1_500 })!.overTolerance).toBe(false);
    expect(missingRoundsFigures({ ...summary, missing: 1_501 })!.overTolerance).toBe(true);
  });

  it('names each state with a word and an icon', () => {
    expect(missingRoundsFigures({ ...summary, missing: 0 })).toMatchObject({ word: 'None missing', icon: 'check_circle', anyMissing: false });
    expect(missingRoundsFigures({ ...summary, missing: 20 })).toMatchObject({ word: 'Within tolerance', icon: 'info', anyMissing: true });
  });

  it('is null for a result without the summary', () => {
    expect(missingRoundsFigures(null)).toBeNull();
    expect(missingRoundsFigures(undefined)).toBeNull();
  });
});
