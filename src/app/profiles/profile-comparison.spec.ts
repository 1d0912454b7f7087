import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';

import { parseProfile } from '@shared/analysis';
import type { ProfileDto, ProfileVersionDto } from '@shared/api';
import { ProfileComparison } from './profile-comparison';
import { profileDifferences } from './profile-differences';

const base = (parseProfile({}) as { profile: Record<string, unknown> }).profile;
const version = (id: number, number: number, parameters: Record<string, unknown>, note = ''): ProfileVersionDto => ({
  id,
  profileId: 4,
  version: number,
  parameters,
  note,
  createdBy: 'Maren Holt',
  createdAt: '2026-11-01T08:00:00Z',
  usedByRuns: 0,
});
const v1 = version(41, 1, { ...base, chshTolerance: 0.03 });
const v2 = version(42, 2, { ...base, chshTolerance: 0.02, testSelection: { mode: 'bernoulli', probability: 0.05 } }, 'tighter for the winter detectors');
const v3 = version(43, 3, { ...base, chshTolerance: 0.02, testSelection: { mode: 'bernoulli', probability: 0.05 } }, 'the same, re-saved');
const FEN_NIGHT: ProfileDto = { id: 4, name: 'Fen night', description: '', latestVersionId: 43, createdAt: '2026-11-01T08:00:00Z', versions: [v3, v2, v1] };

describe('profileDifferences', () => {
  it('lists the fields that read differently, by their labels, with a dash where a version has no such field', () => {
    expect(profileDifferences(v1.parameters as never, v2.parameters as never)).toEqual([
      { label: 'Test rounds chosen', from: 'Fixed share from the seed', to: 'Each round independently' },
      { label: 'Test fraction', from: String((base['testSelection'] as { fraction: number }).fraction), to: '–' },
      { label: 'CHSH tolerance η', from: '0.03', to: '0.02' },
      { label: 'Test probability γ', from: '–', to: '0.05' },
    ]);
    expect(profileDifferences(v2.parameters as never, v3.parameters as never)).toEqual([]);
  });

  it('reads a version saved before space-like separation could be required as reporting it', () => {
    const { spaceLikeSeparation: _added, ...older } = base;
    expect(profileDifferences(older as never, base as never)).toEqual([]);
    expect(profileDifferences(older as never, { ...base, spaceLikeSeparation: 'required' } as never)).toEqual([
      { label: 'Space-like separation', from: 'Reported, not judged', to: 'Required of every round' },
    ]);
  });
});

describe('ProfileComparison', () => {
  let fixture: ComponentFixture<ProfileComparison>;
  let host: HTMLElement;
  const rows = () => Array.from(host.querySelectorAll('tbody tr')).map((row) => Array.from(row.children).map((cell) => cell.textContent.trim()));
  const headers = () => Array.from(host.querySelectorAll('thead th')).map((cell) => cell.textContent.trim());

  async function show(shown: ProfileVersionDto): Promise<void> {
    TestBed.configureTestingModule({ providers: [{ provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }] });
    fixture = TestBed.createComponent(ProfileComparison);
    fixture.componentRef.setInput('profile', FEN_NIGHT);
    fixture.componentRef.setInput('shown', shown);
    host = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  }

  it('compares a version with the one before it, older first', async () => {
    await show(v2);
    expect(headers()).toEqual(['Field', 'v1', 'v2']);
    expect(rows()).toContainEqual(['CHSH tolerance η', '0.03', '0.02']);
  });

  it('says when two versions hold the same rules, and compares v1 with the next one', async () => {
    await show(v3);
    expect(host.textContent).toContain('v2 and v3 hold the same rules.');
    fixture.componentRef.setInput('shown', v1);
    await fixture.whenStable();
    expect(headers()).toEqual(['Field', 'v1', 'v2']);
  });
});
