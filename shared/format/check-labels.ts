import type { CheckFamily } from '../analysis/profile';
import { SPACE_LIKE_CHECK_ID } from '../analysis/stations/space-like-rule';

/** Words for the check families, as a profile's "tests that abort a run" lists them. */
export const CHECK_FAMILY_LABELS: Record<CheckFamily, string> = {
  'log-integrity': 'Log integrity',
  'minimum-test-rounds': 'Minimum test rounds',
  'setting-uniformity': 'Setting uniformity',
  'no-signalling': 'No-signalling',
  stationarity: 'Stationarity',
  'test-marks': 'The log’s test marks',
};

/** The label of every check the engine runs, by its id: short enough for one line of the PDF's table. */
const CHECK_LABELS: Readonly<Record<string, string>> = {
  'log-integrity': 'Log integrity',
  'minimum-test-rounds': 'Minimum test rounds',
  'setting-uniformity-x': 'Uniform setting x (station A)',
  'setting-uniformity-y': 'Uniform setting y (station B)',
  'setting-uniformity-joint': 'Uniform setting pairs (x, y)',
  'setting-uniformity-test': 'Uniform pairs in test rounds',
  'no-signalling-a': 'No signalling to station A',
  'no-signalling-b': 'No signalling to station B',
  'stationarity-chsh': 'Steady CHSH win fraction',
  'stationarity-qber': 'Steady QBER',
  'test-marks-settings': 'Test marks ignore the settings',
  'test-marks-chsh': 'Test marks ignore CHSH wins',
  'test-marks-qber': 'Test marks ignore key errors',
  'test-marks-rate': 'Share of test marks is γ',
  [SPACE_LIKE_CHECK_ID]: 'Space-like separation',
};

/**
 * The label of a check, the one name the app, the mail and the PDF give it. An id this table does
 * not know (a check of a later engine read by an older one) reads as its words: "some-new-check"
 * becomes "Some new check", so a result never shows a blank name.
 */
export function checkLabel(id: string): string {
  const known = Object.hasOwn(CHECK_LABELS, id) ? CHECK_LABELS[id] : undefined;
  if (known) return known;
  const words = id.replace(/[-_]+/g, ' ').trim();
  return words === '' ? 'Unnamed test' : words.charAt(0).toUpperCase() + words.slice(1);
}
