import { AlignmentDecision, OffsetEvidence } from './alignment-decision';
import { alignmentSentence, signedRounds } from './alignment-words';

const evidence = (offset: number, chshValue: number | null): OffsetEvidence => ({ offset, chshValue, deviation: 0.1, lower: 0, upper: 0 });

const decision = (centre: number, atCentre: OffsetEvidence, best: OffsetEvidence, shifted: boolean): AlignmentDecision => ({
  centre,
  significance: 1e-6,
  series: [],
  atCentre,
  best,
  shifted,
});

describe('alignmentSentence', () => {
  it("says a negative offset is B's record running behind A's: B numbers the trigger A calls r as r − 3", () => {
    expect(alignmentSentence(decision(0, evidence(0, 0.021), evidence(-3, 2.7149), true))).toBe(
      "Station B's record runs 3 rounds behind station A's: at that offset S = 2.71, at zero 0.02.",
    );
  });

  it('says a positive offset is running ahead, one round in the singular', () => {
    expect(alignmentSentence(decision(0, evidence(0, -0.004), evidence(1, 2.7), true))).toBe(
      "Station B's record runs 1 round ahead of station A's: at that offset S = 2.70, at zero 0.00.",
    );
  });

  it('names the stated offset as the comparison when there is one', () => {
    expect(alignmentSentence(decision(5, evidence(5, 0.1), evidence(7, -2.6), true))).toBe(
      "Station B's record runs 7 rounds ahead of station A's: at that offset S = −2.60, at the stated offset (+5) 0.10.",
    );
  });

  it('says no offset fits clearly better, with the range scanned and the best other', () => {
    expect(alignmentSentence(decision(0, evidence(0, 2.74), evidence(4, -0.3), false))).toBe(
      'No offset from −16 to +16 fits clearly better than zero: S = 2.74 at zero, −0.30 at the best other offset (+4).',
    );
    expect(alignmentSentence(decision(-20, evidence(-20, null), evidence(-30, 1), false))).toBe(
      'No offset from −36 to −4 fits clearly better than the stated offset (−20): S = – at the stated offset (−20), 1.00 at the best other offset (−30).',
    );
  });

  it('writes offsets with their sign', () => {
    expect([signedRounds(3), signedRounds(-12_000), signedRounds(0)]).toEqual(['+3', '−12\u2009000', '0']);
  });
});
