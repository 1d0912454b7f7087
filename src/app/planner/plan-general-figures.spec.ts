import { TestBed } from '@angular/core/testing';

import { type AnalysisProfile, expectedSiftedProtocol, parseProfile } from '@shared/analysis';
import type { GeneralKeyPoint } from '@shared/api';
import { PlanGeneralFigures } from './plan-general-figures';

const profileWith = (requirePositiveKey: boolean) => (parseProfile({ requirePositiveKey }) as { profile: AnalysisProfile }).profile;

/** The general key at N = 10^5 where the entropy bound leaves none, though CHSH alone would nearly always pass. */
const noKeyHere: GeneralKeyPoint = {
  rounds: 100_000,
  testProbability: 0.1,
  sifted: expectedSiftedProtocol(100_000, 0.1),
  bits: 0,
  syndromeBits: 0,
  omegaThreshold: 0.81,
  reason: 'the entropy bound is below the error correction cost at this N',
  chshPassProbability: 0.9995,
  passProbability: 0,
};

function passRow(requirePositiveKey: boolean): string {
  TestBed.configureTestingModule({});
  const fixture = TestBed.createComponent(PlanGeneralFigures);
  fixture.componentRef.setInput('progress', { status: 'ready', plan: { at: noKeyHere } });
  fixture.componentRef.setInput('profile', profileWith(requirePositiveKey));
  fixture.detectChanges();
  return (fixture.nativeElement as HTMLElement).querySelector('[data-testid="plan-general-pass"]')!.textContent.replace(/\s+/g, ' ').trim();
}

describe('PlanGeneralFigures', () => {
  it('says why the pass probability is nil when CHSH alone would pass: the profile requires a key none can give here', () => {
    const row = passRow(true);
    expect(row).toMatch(/^0(\.0)?\s?%/);
    expect(row).toContain('CHSH against ω_thr alone: > 99.9');
    expect(row).toContain('the profile requires a positive key, and none is possible at this N');
  });

  it('names the other criteria when a missing key fails nothing', () => {
    expect(passRow(false)).toContain('the error rate and the test-round count as in the collective plan');
  });
});
