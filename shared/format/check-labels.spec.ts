import { CHECK_FAMILIES } from '../analysis/profile';
import { SPACE_LIKE_CHECK_ID } from '../analysis/stations/space-like-rule';
import { CHECK_FAMILY_LABELS, checkLabel } from './check-labels';

/** Every check id the engine's checks produce (the ids in shared/analysis/checks and the timing rule). */
const ENGINE_CHECK_IDS = [
  'log-integrity',
  'minimum-test-rounds',
  'setting-uniformity-x',
  'setting-uniformity-y',
  'setting-uniformity-joint',
  'setting-uniformity-test',
  'no-signalling-a',
  'no-signalling-b',
  'stationarity-chsh',
  'stationarity-qber',
  'test-marks-settings',
  'test-marks-chsh',
  'test-marks-qber',
  'test-marks-rate',
  SPACE_LIKE_CHECK_ID,
];

describe('the label of a check', () => {
  it('names every engine check in words, not by its id, and no two alike', () => {
    const labels = ENGINE_CHECK_IDS.map(checkLabel);
    labels.forEach((label, index) => {
      expect(label).not.toBe(ENGINE_CHECK_IDS[index]);
      expect(label).not.toMatch(/^[a-z-]+$/);
    });
    expect(new Set(labels).size).toBe(labels.length);
  });

  it('says which station and setting a uniformity check is about', () => {
    expect(checkLabel('setting-uniformity-x')).toBe('Uniform setting x (station A)');
    expect(checkLabel('no-signalling-b')).toBe('No signalling to station B');
    expect(checkLabel(SPACE_LIKE_CHECK_ID)).toBe('Space-like separation');
  });

  it('reads an id it does not know as words, and never gives a blank name', () => {
    expect(checkLabel('phase-drift-z')).toBe('Phase drift z');
    expect(checkLabel('toString')).toBe('ToString');
    expect(checkLabel('--')).toBe('Unnamed test');
  });

  it('has a word for every check family', () => {
    for (const family of CHECK_FAMILIES) expect(CHECK_FAMILY_LABELS[family]).toMatch(/^[A-Z]/);
  });
});
