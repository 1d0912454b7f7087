import type { HttpTestingController } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';

import type { ProfileDto } from '@shared/api';
import { parseProfile } from '@shared/analysis';
import { settle } from '../../testing/settle';
import { signInAs } from '../../testing/sign-in-as';
import { ProfileList } from './profile-list';
import { configureApiTestBed } from '../../testing/dialog-test-bed';

const parameters = (parseProfile({}) as { profile: Record<string, unknown> }).profile;

/** Twelve profiles of the invented lab: "Fen night 1" … "Fen night 11", and one for the long Heron Reach link. */
const PROFILES: ProfileDto[] = Array.from({ length: 12 }, (_, index) => ({
  id: index + 1,
  name: index === 11 ? 'Heron Reach long link' : `Fen night ${index + 1}`,
  description: index === 11 ? 'The 14 km fibre between the two huts' : 'Bench nights',
  latestVersionId: 100 + index,
  createdAt: '2026-11-01T08:00:00Z',
  versions: [
    {
      id: 100 + index,
      profileId: index + 1,
      version: 1,
      parameters,
      note: index === 3 ? 'raised for the winter detectors' : '',
      createdBy: 'Maren Holt',
      createdAt: '2026-11-01T08:00:00Z',
      usedByRuns: 0,
    },
  ],
}));

describe('ProfileList', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<ProfileList>;
  let host: HTMLElement;

  const shownNames = (): string[] => Array.from(host.querySelectorAll('section h2')).map((heading) => heading.textContent.trim());

  async function search(words: string): Promise<void> {
    const field = host.querySelector<HTMLInputElement>('bk-word-search input')!;
    field.value = words;
    field.dispatchEvent(new Event('input'));
    await settle(fixture, 300);
  }

  beforeEach(async () => {
    jest.useFakeTimers();
    http = configureApiTestBed();
    signInAs(['auditor']);
    fixture = TestBed.createComponent(ProfileList);
    host = fixture.nativeElement as HTMLElement;
    await settle(fixture);
    http.expectOne('/api/profiles').flush(PROFILES);
    await settle(fixture);
  });

  afterEach(() => {
    http.verify();
    jest.useRealTimers();
  });

  it('shows the first ten profiles with a paginator over all twelve', () => {
    expect(shownNames()).toEqual(PROFILES.slice(0, 10).map((profile) => profile.name));
    expect(host.querySelector('.mat-mdc-paginator-range-label')!.textContent).toContain('12');
  });

  it('finds profiles by name, description or a version note, in either case, and says when none holds the words', async () => {
    await search('HUTS');
    http.expectOne('/api/profiles').flush(PROFILES);
    await settle(fixture);
    expect(shownNames()).toEqual(['Heron Reach long link']);

    await search('winter');
    http.expectOne('/api/profiles').flush(PROFILES);
    await settle(fixture);
    expect(shownNames()).toEqual(['Fen night 4']);

    await search('kestrel');
    http.expectOne('/api/profiles').flush(PROFILES);
    await settle(fixture);
    expect(host.querySelector('[data-testid="profiles-empty"]')!.textContent).toContain('No profile holds these words.');
    host.querySelector<HTMLButtonElement>('[data-testid="profiles-empty"] button')!.click();
    await settle(fixture, 300);
    http.expectOne('/api/profiles').flush(PROFILES);
    await settle(fixture);
    expect(shownNames()).toHaveLength(10);
  });
});
