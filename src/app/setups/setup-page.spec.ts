import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatRadioGroupHarness } from '@angular/material/radio/testing';
import { provideRouter } from '@angular/router';

import type { BookingDto, CreatedUploadTokenDto, Role, UploadTokenDto } from '@shared/api';
import { CHART_PROVIDERS } from '../charts/chart-providers';
import { SetupPage } from './setup-page';
import { signInAs } from '../../testing/sign-in-as';
import { specSetup } from '../../testing/spec-setup';

const setup = specSetup({
  description: 'North Hall to Mill Lane over 2.4 km of campus fibre.',
  shiftLeads: [{ id: 4, name: 'Lucia Brandt', email: 'lucia.brandt@kestrelfen.example' }],
});

const commitment = '777ddf8cec451a4bdc78edf2e608beeaa3a6b5faa240f5c2edae085b77d51ee6';

const booked: BookingDto = {
  id: 7,
  setupId: 2,
  setupName: 'Fen link',
  night: '2027-03-14',
  windowStart: '2027-03-14T19:00:00Z',
  windowEnd: '2027-03-15T05:00:00Z',
  plannedRounds: 2_000_000,
  profileVersionId: 12,
  profileName: 'Nightly standard',
  profileVersion: 2,
  profileReason: '',
  seedCommitment: commitment,
  seed: '9f2c4e81a7d35b60c8e1f4a29b7d03e56a1c8f42e7b90d35c6a2f81e4b7d09c3',
  bookedBy: 'Dev Okafor',
  createdAt: '2027-03-14T17:00:00Z',
  attempts: [
    { runId: 40, attempt: 1, state: 'aborted', verdict: 'ABORT', replacementReason: '', createdAt: '2027-03-15T06:10:00Z' },
    {
      runId: 41,
      attempt: 2,
      state: 'accepted',
      verdict: 'ACCEPT',
      replacementReason: 'Detector B was saturated; log re-read from the second disk.',
      createdAt: '2027-03-15T07:30:00Z',
    },
  ],
};

const awaiting: BookingDto = {
  ...booked,
  id: 8,
  night: '2027-03-15',
  windowStart: '2027-03-15T19:00:00Z',
  windowEnd: '2027-03-16T05:00:00Z',
  profileVersionId: 11,
  profileVersion: 1,
  profileReason: 'Tolerance study agreed with Sami Virtanen.',
  seed: null,
  attempts: [],
};

const token: UploadTokenDto = {
  id: 3,
  setupId: 2,
  name: 'North Hall acquisition PC',
  createdBy: 'Lucia Brandt',
  createdAt: '2027-01-10T09:00:00Z',
  expiresAt: '2099-01-10T09:00:00Z',
  revokedAt: null,
  lastUsedAt: '2027-03-15T06:10:00Z',
  station: null,
};

describe('SetupPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<SetupPage>;
  let loader: HarnessLoader;
  let documentLoader: HarnessLoader;
  let host: HTMLElement;

  beforeAll(() => {
    // jsdom has no canvas: the trend chart then draws nothing.
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
  });

  afterAll(() => jest.restoreAllMocks());

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), CHART_PROVIDERS, { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  /** Signs in as `name` with `roles` and opens setup 2 with its bookings. */
  async function openAs(id: number, name: string, roles: Role[], bookings: BookingDto[] = [booked, awaiting]): Promise<void> {
    signInAs(roles, { id, name, email: 'someone@kestrelfen.example' });
    fixture = TestBed.createComponent(SetupPage);
    fixture.componentRef.setInput('id', '2');
    loader = TestbedHarnessEnvironment.loader(fixture);
    documentLoader = TestbedHarnessEnvironment.documentRootLoader(fixture);
    host = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    http.expectOne('/api/setups/2').flush(setup);
    http.expectOne('/api/bookings?setupId=2').flush(bookings);
    await fixture.whenStable();
    http.match((request) => request.url === '/api/runs').forEach((request: TestRequest) => request.flush({ items: [], total: 0, page: 0, pageSize: 200 }));
    await fixture.whenStable();
  }

  /** Each row of the table as one line, its cells joined by " | ". */
  const rowText = (selector: string) =>
    Array.from(host.querySelectorAll(`${selector} tbody tr`), (row) => Array.from(row.children, (cell) => cell.textContent.replace(/\s+/g, ' ').trim()).join(' | '));

  it('lists the booked nights with their commitment, profile and the logs that came', async () => {
    await openAs(9, 'Dev Okafor', ['experimentalist']);

    const [withLogs, waiting] = rowText('[data-testid="bookings"]');
    expect(withLogs).toContain('Sun, Mar 14, 2027');
    expect(withLogs).toContain('booked by Dev Okafor');
    expect(withLogs).toContain('2 000 000');
    expect(withLogs).toContain('777ddf8cec45…');
    expect(withLogs).toContain('2 attempts');
    expect(withLogs).toMatch(/#40 blockABORT #41 verifiedACCEPT$/);
    expect(host.querySelector('[aria-label="Run 41, attempt 2"]')?.getAttribute('href')).toBe('/runs/41');
    expect(host.querySelector('[data-testid="booking-7"] code')?.getAttribute('title')).toBe(commitment);
    expect(waiting).toContain('Awaiting log');
    expect(waiting).toContain("Not the setup's: Tolerance study agreed with Sami Virtanen.");
  });

  it('shows upload tokens to no one but admins and the setup’s shift leads; the recipe to everyone', async () => {
    await openAs(9, 'Dev Okafor', ['experimentalist', 'shift-lead']);
    expect(host.querySelector('[data-testid="upload-tokens-panel"]')).toBeNull();
    const recipe = host.querySelector('[data-testid="acquisition-recipe"]')?.textContent ?? '';
    expect(recipe).toContain(`${location.origin}/api/uploads`);
    expect(recipe).toContain('Bearer <upload token>');
  });

  it('says how to book when no night is booked yet', async () => {
    await openAs(9, 'Dev Okafor', ['experimentalist'], []);
    expect(host.querySelector('[data-testid="no-bookings"]')?.textContent).toContain('No night of Fen link is booked yet. Book tonight from the planner');
  });

  describe('upload tokens', () => {
    async function openAsLead(): Promise<void> {
      await openAs(4, 'Lucia Brandt', ['shift-lead']);
      http.expectOne('/api/setups/2/upload-tokens').flush([token, { ...token, id: 2, name: 'Old laptop', revokedAt: '2027-02-01T10:00:00Z', lastUsedAt: null }]);
      await fixture.whenStable();
    }

    it('lists them with their state, last use and expiry', async () => {
      await openAsLead();
      const [live, revoked] = rowText('[data-testid="upload-tokens"]');
      // The state cell starts with its icon's ligature name, then the word.
      expect(live).toMatch(
        /^North Hall acquisition PC made by Lucia Brandt, Jan 10, 2027 \| Joined logs \| keyIn use \| Mar 15, 2027, \d\d:\d0 [AP]M (UTC|GMT[+-]\d+(:\d\d)?) \| Jan 10, 2099 \| Revoke$/,
      );
      expect(revoked).toMatch(/^Old laptop .* \| key_offRevoked Feb 1, 2027, \d\d:00 [AP]M (UTC|GMT[+-]\d+(:\d\d)?) \| Never \| Jan 10, 2099 \| $/);
    });

    it('shows a new token once, with a copy button and the warning, then lists it', async () => {
      await openAsLead();
      await (await loader.getHarness(MatButtonHarness.with({ text: /New token/ }))).click();
      const dialog = await documentLoader.getHarness(MatDialogHarness);
      await (await dialog.getHarness(MatInputHarness.with({ selector: '[data-testid="token-name"]' }))).setValue('Mill Lane acquisition PC');
      await (await dialog.getHarness(MatButtonHarness.with({ text: 'Make the token' }))).click();

      const request = http.expectOne({ method: 'POST', url: '/api/setups/2/upload-tokens' });
      expect(request.request.body).toEqual({ name: 'Mill Lane acquisition PC', validDays: 90 });
      const created: CreatedUploadTokenDto = { ...token, id: 4, name: 'Mill Lane acquisition PC', lastUsedAt: null, token: 'bkup_Zq3vJm0x' };
      request.flush(created, { status: 201, statusText: 'Created' });
      await fixture.whenStable();

      const text = await dialog.getText();
      expect(text).toContain('bkup_Zq3vJm0x');
      expect(text).toContain('Copy it now: it will not be shown again.');
      expect(await dialog.getHarness(MatButtonHarness.with({ text: /Copy the token/ }))).toBeTruthy();

      await (await dialog.getHarness(MatButtonHarness.with({ text: 'I have copied it' }))).click();
      http.expectOne('/api/setups/2/upload-tokens').flush([created, token]);
      await fixture.whenStable();
      expect(rowText('[data-testid="upload-tokens"]')[0]).toContain('Mill Lane acquisition PC');
      expect(host.textContent).not.toContain('bkup_Zq3vJm0x');
    });

    it('makes a token for one station’s computer, which the list names', async () => {
      await openAsLead();
      await (await loader.getHarness(MatButtonHarness.with({ text: /New token/ }))).click();
      const dialog = await documentLoader.getHarness(MatDialogHarness);
      await (await dialog.getHarness(MatInputHarness.with({ selector: '[data-testid="token-name"]' }))).setValue('Mill Lane station PC');
      const uploads = await dialog.getHarness(MatRadioGroupHarness);
      expect(await Promise.all((await uploads.getRadioButtons()).map((choice) => choice.getLabelText()))).toEqual([
        'Joined logs',
        'Station A’s computer (North Hall)',
        'Station B’s computer (Mill Lane)',
      ]);
      await uploads.checkRadioButton({ label: 'Station B’s computer (Mill Lane)' });
      await (await dialog.getHarness(MatButtonHarness.with({ text: 'Make the token' }))).click();

      const request = http.expectOne({ method: 'POST', url: '/api/setups/2/upload-tokens' });
      expect(request.request.body).toEqual({ name: 'Mill Lane station PC', validDays: 90, station: 'B' });
      const created: CreatedUploadTokenDto = { ...token, id: 5, name: 'Mill Lane station PC', station: 'B', lastUsedAt: null, token: 'bkup_Pw8tLr2c' };
      request.flush(created, { status: 201, statusText: 'Created' });
      await fixture.whenStable();
      expect(await dialog.getText()).toContain('lets station B’s own logs of Fen link in');

      await (await dialog.getHarness(MatButtonHarness.with({ text: 'I have copied it' }))).click();
      http.expectOne('/api/setups/2/upload-tokens').flush([created, token]);
      await fixture.whenStable();
      expect(rowText('[data-testid="upload-tokens"]')[0]).toMatch(/^Mill Lane station PC .* \| Station B’s log \(Mill Lane\) \| keyIn use/);
    });

    it('revokes a token only after asking', async () => {
      await openAsLead();
      await (await loader.getHarness(MatButtonHarness.with({ text: 'Revoke' }))).click();
      const question = await documentLoader.getHarness(MatDialogHarness);
      expect(await question.getText()).toContain('Revoke “North Hall acquisition PC”?');
      await (await question.getHarness(MatButtonHarness.with({ text: 'Revoke' }))).click();

      http.expectOne({ method: 'POST', url: '/api/setups/2/upload-tokens/3/revoke' }).flush({ ...token, revokedAt: '2027-03-16T08:00:00Z' });
      await fixture.whenStable();
      http.expectOne('/api/setups/2/upload-tokens').flush([{ ...token, revokedAt: '2027-03-16T08:00:00Z' }]);
      await fixture.whenStable();
      expect(rowText('[data-testid="upload-tokens"]')[0]).toContain('Revoked');
      expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Revoke' }))).toHaveLength(0);
    });
  });
});
