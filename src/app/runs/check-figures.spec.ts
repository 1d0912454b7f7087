import type { CheckResult } from '@shared/analysis';
import { checkFigures } from './check-figures';

const sharing = { significance: 0.001, count: 9, perCheck: 0.001 / 9, correction: '' };

function check(changes: Partial<CheckResult>): CheckResult {
  return { id: 'no-signalling-a', status: 'pass', observed: 0.42, log10PValue: Math.log10(0.42), threshold: 0.001 / 9, message: '', ...changes };
}

describe('checkFigures', () => {
  it('gives the p-value and the threshold as the significance shared among the checks', () => {
    expect(checkFigures(check({}), sharing)).toEqual({ pValue: '0.420', threshold: 'α/k = 1e-3/9 = 1.1e-4' });
  });

  it('reads the p-value from its log10, so a tail that underflowed never reads 0', () => {
    const figures = checkFigures(check({ status: 'fail', observed: 0, log10PValue: -1234.5 }), sharing);
    expect(figures!.pValue).toBe('3.2e-1235');
  });

  it('gives the bare threshold when the result does not say how the significance was shared', () => {
    expect(checkFigures(check({}), null)!.threshold).toBe('1.1e-4');
  });

  it('has no figures for a counting check or a check stored without its log10 p-value', () => {
    expect(checkFigures(check({ id: 'minimum-test-rounds', observed: 1200, log10PValue: null, threshold: 1000 }), sharing)).toBeNull();
    const older = check({});
    delete (older as Partial<CheckResult>).log10PValue;
    expect(checkFigures(older, sharing)).toBeNull();
  });
});
