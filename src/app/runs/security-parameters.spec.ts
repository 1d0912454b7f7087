import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';

import { type KeySummary, profileSchema, type SecuritySummary, summariseSecurity } from '@shared/analysis';
import { SecurityParameters } from './security-parameters';

// The collective model needs nothing of the key summary: the terms come from the profile.
const collective = summariseSecurity(profileSchema.parse({ epsilon: 1e-9, epsilonEC: 1e-10, epsilonPA: 1e-10, significance: 0.001 }), {} as KeySummary, 8);

describe('SecurityParameters', () => {
  let fixture: ComponentFixture<SecurityParameters>;

  async function show(security: SecuritySummary): Promise<HTMLElement> {
    TestBed.configureTestingModule({ providers: [{ provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }] });
    fixture = TestBed.createComponent(SecurityParameters);
    fixture.componentRef.setInput('security', security);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  const words = (element: Element | null | undefined) => element?.textContent?.replace(/\s+/g, ' ').trim();

  it('gives the total ε of the key figure, the sum of its four terms under the union bound', async () => {
    const host = await show(collective);
    // 1e-9 + 1e-9 + 1e-10 + 1e-10 = 2.2e-9.
    expect(words(host.querySelector('[data-testid="key-epsilon"]'))).toBe('ε_key = 2.2e-9 (4 terms)');
    expect(words(host.querySelector('[data-testid="epsilon-rule"]'))).toBe('union bound: ε_key ≤ ε + ε + ε_EC + ε_PA');
  });

  it('lists every term with its value in scientific notation and what it bounds', async () => {
    const host = await show(collective);
    const rows = Array.from(host.querySelectorAll('[data-testid="epsilon-terms"] tbody tr'), (row) => [
      row.querySelector('th')?.getAttribute('scope'),
      words(row.querySelector('th')),
      words(row.querySelector('td')),
    ]);
    expect(rows).toEqual([
      ['row', 'ε', '1e-9'],
      ['row', 'ε', '1e-9'],
      ['row', 'ε_EC', '1e-10'],
      ['row', 'ε_PA', '1e-10'],
    ]);
  });

  it('says how the statistical checks share the significance', async () => {
    const host = await show(collective);
    // 0.001 / 8 = 1.25e-4, to two digits.
    expect(words(host.querySelector('[data-testid="check-sharing"]'))).toBe('α = 1e-3 shared by 8 statistical tests of the log: each at α/k = 1.3e-4');
    expect(words(host.querySelector('[data-testid="check-correction"]'))).toContain('each of the 8 statistical checks fails below p = α/8');
  });

  it('names the attack model beside the caution', async () => {
    const host = await show({ ...collective, model: 'general' });
    expect(words(host.querySelector('bk-key-caution'))).toContain('Estimate against general attacks');
  });
});
