import { AnalysisProfile } from '../profile';
import { CHSH_PAIRS, pairWins } from '../report/chsh-summary';
import { keySettingCounts } from '../report/qber-summary';
import { log10BinomialUpperTail } from '../statistics/binomial-tail';
import { log10NormalUpperTail } from '../statistics/chi-squared-tail';
import { chiSquaredIndependence } from '../statistics/independence-test';
import { CheckFinding, statisticalFinding } from './check-result';
import { settingPairCounts } from './setting-uniformity';

/** The declared test probability a profile holds the log's own marks to, if any (general model). */
export function declaredMarkProbability(profile: AnalysisProfile): number | undefined {
  return profile.testSelection.mode === 'from-log' && profile.securityModel === 'general' ? profile.generalAttack?.testProbability : undefined;
}

/** Statistical checks of the log's own marks: none unless the profile takes its test rounds from the log. */
export function testMarkCheckCount(profile: AnalysisProfile): number {
  if (profile.testSelection.mode !== 'from-log') return 0;
  return declaredMarkProbability(profile) === undefined ? 3 : 4;
}

/**
 * When the lab's own `test` column chooses the test rounds, the marks are data the source could
 * shape. They must be independent of the settings and of the outcomes (DOMAIN "Marks and setting
 * shares"), and tested rounds must not look better than untested ones. Each failure blocks ACCEPT
 * whatever the profile's blocking families:
 * - `test-marks-settings`: the setting pair against marked / unmarked, chi-squared test of
 *   independence (Pearson 1900);
 * - `test-marks-chsh`: the balanced win fraction of the marked CHSH rounds against the unmarked
 *   ones, one-sided, stratified by setting pair with the pooled per-pair variance under equal rates
 *   (the two-proportion z-test, e.g. Agresti, Categorical Data Analysis, 3rd ed. (2013), §3.1);
 * - `test-marks-qber`: the error rate of the marked key-setting rounds against the unmarked ones,
 *   one-sided two-proportion z-test: a marked set with fewer errors than the raw key hides them;
 * - `test-marks-rate` (general model): the share of marked rounds against the declared γ, two-sided
 *   exact binomial test (twice the smaller tail, in log space).
 */
export function testMarkChecks(test: readonly number[], generation: readonly number[], profile: AnalysisProfile, significance: number): CheckFinding[] {
  if (profile.testSelection.mode !== 'from-log') return [];
  const family = { family: 'test-marks' as const, alwaysBlocks: true };
  const marked = settingPairCounts(test);
  const unmarked = settingPairCounts(generation);
  const independence = chiSquaredIndependence(marked.map((count, pair) => [count, unmarked[pair]]));
  const findings = [
    statisticalFinding(
      { id: 'test-marks-settings', ...family },
      independence.log10PValue,
      significance,
      (holds, p) =>
        `The log's test marks ${holds ? 'show no dependence on' : 'depend on'} the setting pair (chi-squared ${independence.statistic.toFixed(2)}, ${independence.degreesOfFreedom} dof, p = ${p}).`,
    ),
    chshComparison(test, generation, significance),
    qberComparison(test, generation, significance),
  ];
  const declared = declaredMarkProbability(profile);
  if (declared !== undefined) findings.push(markRate(marked, unmarked, declared, significance));
  return findings.map((finding) => ({ ...finding, ...family }));
}

function chshComparison(test: readonly number[], generation: readonly number[], significance: number): CheckFinding {
  const strata = CHSH_PAIRS.map(({ x, y }) => ({ marked: pairWins(test, x, y), unmarked: pairWins(generation, x, y) }));
  const comparable = strata.every((stratum) => stratum.marked.rounds > 0 && stratum.unmarked.rounds > 0);
  let difference = 0;
  let variance = 0;
  if (comparable) {
    for (const { marked, unmarked } of strata) {
      const pooled = (marked.wins + unmarked.wins) / (marked.rounds + unmarked.rounds);
      difference += (marked.wins / marked.rounds - unmarked.wins / unmarked.rounds) / 4;
      variance += (pooled * (1 - pooled) * (1 / marked.rounds + 1 / unmarked.rounds)) / 16;
    }
  }
  const z = variance > 0 ? difference / Math.sqrt(variance) : 0;
  return statisticalFinding({ id: 'test-marks-chsh', family: 'test-marks' }, log10NormalUpperTail(z), significance, (holds, p) =>
    comparable
      ? `The marked CHSH rounds ${holds ? 'do not win more often' : 'win more often'} than the unmarked ones (balanced win fractions differ by ${difference.toFixed(4)}, z = ${z.toFixed(2)}, p = ${p}).`
      : 'Some CHSH setting pair has no marked or no unmarked rounds: nothing to compare.',
  );
}

function qberComparison(test: readonly number[], generation: readonly number[], significance: number): CheckFinding {
  const marked = keySettingCounts(test);
  const unmarked = keySettingCounts(generation);
  const comparable = marked.rounds > 0 && unmarked.rounds > 0;
  const pooled = comparable ? (marked.errors + unmarked.errors) / (marked.rounds + unmarked.rounds) : 0;
  const spread = Math.sqrt(pooled * (1 - pooled) * (1 / Math.max(marked.rounds, 1) + 1 / Math.max(unmarked.rounds, 1)));
  const difference = comparable ? unmarked.errors / unmarked.rounds - marked.errors / marked.rounds : 0;
  const z = spread > 0 ? difference / spread : 0;
  return statisticalFinding({ id: 'test-marks-qber', family: 'test-marks' }, log10NormalUpperTail(z), significance, (holds, p) =>
    comparable
      ? `The marked key-setting rounds ${holds ? 'show no fewer errors' : 'show fewer errors'} than the unmarked ones (error rates differ by ${difference.toFixed(4)}, z = ${z.toFixed(2)}, p = ${p}).`
      : 'There are no marked or no unmarked key-setting rounds: nothing to compare.',
  );
}

function markRate(marked: readonly number[], unmarked: readonly number[], declared: number, significance: number): CheckFinding {
  const tests = marked.reduce((sum, count) => sum + count, 0);
  const rounds = tests + unmarked.reduce((sum, count) => sum + count, 0);
  const upper = log10BinomialUpperTail(tests, rounds, declared);
  const lower = log10BinomialUpperTail(rounds - tests, rounds, 1 - declared);
  const log10PValue = Math.min(0, Math.log10(2) + Math.min(upper, lower));
  const share = rounds === 0 ? 0 : tests / rounds;
  return statisticalFinding(
    { id: 'test-marks-rate', family: 'test-marks' },
    log10PValue,
    significance,
    (holds, p) =>
      `${(100 * share).toFixed(2)} % of the rounds are marked for testing; the profile declares γ = ${declared} (${holds ? 'consistent' : 'not consistent'}: two-sided binomial p = ${p}).`,
  );
}
