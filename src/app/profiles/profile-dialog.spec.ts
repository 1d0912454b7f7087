import type { HttpTestingController } from '@angular/common/http/testing';
import { ApplicationRef } from '@angular/core';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatSelectHarness } from '@angular/material/select/testing';

import type { ProfileDto } from '@shared/api';
import { parseProfile } from '@shared/analysis';
import { configureDialogTestBed } from '../../testing/dialog-test-bed';
import { ProfileDialog, type ProfileDialogData } from './profile-dialog';

const nightly: ProfileDto = {
  id: 1,
  name: 'Nightly standard',
  description: 'Fen link nights',
  latestVersionId: 11,
  createdAt: '2026-11-01T08:00:00Z',
  versions: [
    {
      id: 11,
      profileId: 1,
      version: 2,
      parameters: (parseProfile({ chshTolerance: 0.04 }) as { profile: Record<string, unknown> }).profile,
      note: '',
      createdBy: 'Maren Holt',
      createdAt: '2026-11-20T08:00:00Z',
      usedByRuns: 3,
    },
  ],
};

describe('ProfileDialog', () => {
  let http: HttpTestingController;
  const close = jest.fn();

  function open(data: ProfileDialogData): HTMLElement {
    http = configureDialogTestBed(data, close);
    const fixture = TestBed.createComponent(ProfileDialog);
    fixture.detectChanges();
    return fixture.nativeElement as HTMLElement;
  }

  async function type(host: HTMLElement, field: string, value: string): Promise<void> {
    const input = host.querySelector<HTMLInputElement>(`[data-testid="profile-${field}"]`)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
    await TestBed.inject(ApplicationRef).whenStable();
  }

  async function submit(host: HTMLElement): Promise<void> {
    host.querySelector<HTMLFormElement>('form')!.dispatchEvent(new Event('submit'));
    await TestBed.inject(ApplicationRef).whenStable();
  }

  const errors = (host: HTMLElement) => Array.from(host.querySelectorAll('mat-error'), (error) => error.textContent?.trim());

  afterEach(() => {
    http.verify();
    close.mockReset();
  });

  it('starts from the latest version and explains each field in its hint', () => {
    const host = open({ profile: nightly });
    expect(host.querySelector<HTMLInputElement>('[data-testid="profile-chshTolerance"]')!.value).toBe('0.04');
    expect(host.querySelector<HTMLInputElement>('[data-testid="profile-epsilon"]')!.value).toBe('1e-9');
    expect(host.textContent).toContain('Accept when the win fraction reaches ω_Q − η');
  });

  it('refuses values the engine refuses, with the engine’s own sentences, and sends nothing', async () => {
    const host = open({ profile: nightly });
    await type(host, 'chshTolerance', '0.3');
    await type(host, 'epsilon', '1.5');
    await type(host, 'minTestRounds', '12.5');
    await type(host, 'significance', 'often');
    await submit(host);

    expect(errors(host)).toEqual([
      'Must be at most 0.25 (ω_Q − 0.25 is below the local bound)',
      'Epsilon must be below 1.',
      'Must be a whole number.',
      'Significance must be a number.',
    ]);
    http.expectNone('/api/profiles/1/versions');
  });

  it('saves a valid form as a new version with every parameter and closes with the profile', async () => {
    const host = open({ profile: nightly });
    await type(host, 'qberTolerance', '0.06');
    await submit(host);

    const request = http.expectOne('/api/profiles/1/versions');
    expect(request.request.body).toEqual({ parameters: { ...nightly.versions[0].parameters, qberTolerance: 0.06 }, note: undefined });
    const saved = { ...nightly, latestVersionId: 12 };
    request.flush(saved, { status: 201, statusText: 'Created' });
    expect(close).toHaveBeenCalledWith(saved);
  });

  it('shows the server’s sentence and the field it names when it refuses the profile', async () => {
    const host = open({ profile: nightly });
    await submit(host);
    http
      .expectOne('/api/profiles/1/versions')
      .flush({ error: { code: 'validation', message: 'parameters.epsilon: must be below 1', field: 'parameters.epsilon' } }, { status: 400, statusText: 'Bad Request' });
    await TestBed.inject(ApplicationRef).whenStable();
    expect(host.querySelector('[role="alert"]')?.textContent).toContain('parameters.epsilon: must be below 1 (field parameters.epsilon)');
    expect(close).not.toHaveBeenCalled();
  });

  it('edits the general-attack settings: the design values shown, each checked by the engine, all saved', async () => {
    const parameters = (
      parseProfile({ testSelection: { mode: 'bernoulli', probability: 13 / 256 }, securityModel: 'general', generalAttack: { design: { chshValue: 2.64, qber: 0.018 } } }) as {
        profile: Record<string, unknown>;
      }
    ).profile;
    const host = open({ profile: { ...nightly, versions: [{ ...nightly.versions[0], parameters }] } });
    const shown = (field: string) => host.querySelector<HTMLInputElement>(`[data-testid="profile-${field}"]`)?.value;
    expect([shown('generalSoundness'), shown('designChshValue'), shown('designQber')]).toEqual(['1e-10', '2.64', '0.018']);
    // The fixed basis and the marking's γ are not part of this profile: their fields are not shown.
    expect([shown('omegaThreshold'), shown('syndromeBits'), shown('generalTestProbability')]).toEqual([undefined, undefined, undefined]);

    await type(host, 'designChshValue', '2.9');
    await type(host, 'designQber', '0.6');
    await submit(host);
    expect(errors(host)).toEqual(['Must be at most 2√2.', 'The design QBER must be below 0.5.']);
    http.expectNone('/api/profiles/1/versions');

    await type(host, 'designChshValue', '2.7');
    await type(host, 'designQber', '0.02');
    await type(host, 'generalSoundness', '1e-9');
    await submit(host);
    const request = http.expectOne('/api/profiles/1/versions');
    const sent = (request.request.body as { parameters: Record<string, unknown> }).parameters;
    expect(sent['generalAttack']).toEqual({ soundness: 1e-9, design: { chshValue: 2.7, qber: 0.02 } });
    expect(sent['securityModel']).toBe('general');
  });

  it('offers space-like separation reported or required: a version saved before the field reads as reported, and the choice is saved', async () => {
    const { spaceLikeSeparation: _added, ...older } = nightly.versions[0].parameters;
    http = configureDialogTestBed({ profile: { ...nightly, versions: [{ ...nightly.versions[0], parameters: older }] } }, close);
    const fixture = TestBed.createComponent(ProfileDialog);
    fixture.detectChanges();
    const host = fixture.nativeElement as HTMLElement;
    const select = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSelectHarness.with({ selector: '[data-testid="profile-spaceLikeSeparation"]' }));
    expect(await select.getValueText()).toBe('Reported, not judged');
    expect(host.textContent).toContain('Required: a run that cannot show it is INVALID, and any round without it aborts the run.');
    await select.open();
    expect(await Promise.all((await select.getOptions()).map((option) => option.getText()))).toEqual(['Reported, not judged', 'Required of every round']);
    await select.clickOptions({ text: 'Required of every round' });
    await submit(host);

    const request = http.expectOne('/api/profiles/1/versions');
    expect((request.request.body as { parameters: Record<string, unknown> }).parameters['spaceLikeSeparation']).toBe('required');
  });

  it('needs a name for a new profile', async () => {
    const host = open({ profile: null });
    await submit(host);
    expect(errors(host)).toEqual(['Enter a name for the profile.']);
    http.expectNone('/api/profiles');
  });
});
