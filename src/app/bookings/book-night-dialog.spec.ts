import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { Component } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialog } from '@angular/material/dialog';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter } from '@angular/router';

import type { BookingDto, ProfileDto, Role } from '@shared/api';
import { formatCount } from '@shared/format/numbers';
import { BookNightDialog, type BookNightData } from './book-night-dialog';
import { signInAs, SOMEONE } from '../../testing/sign-in-as';
import { specSetup } from '../../testing/spec-setup';

/** Somewhere for the dialog to open from. */
@Component({ template: '' })
class Host {}

const setup = specSetup({ shiftLeads: [{ id: 4, name: 'Lucia Brandt', email: 'lucia.brandt@kestrelfen.example' }] });

const version = (id: number, profileId: number, number: number) => ({
  id,
  profileId,
  version: number,
  parameters: {},
  note: '',
  createdBy: 'Maren Holt',
  createdAt: '2026-11-20T08:00:00Z',
  usedByRuns: 0,
});
const profiles: ProfileDto[] = [
  { id: 1, name: 'Nightly standard', description: '', latestVersionId: 12, createdAt: '2026-11-01T08:00:00Z', versions: [version(12, 1, 2), version(11, 1, 1)] },
  { id: 2, name: 'Tolerance study', description: '', latestVersionId: 21, createdAt: '2026-11-02T08:00:00Z', versions: [version(21, 2, 1)] },
];

const booking: BookingDto = {
  id: 8,
  setupId: 2,
  setupName: 'Fen link',
  night: '2027-03-14',
  windowStart: '2027-03-14T20:00:00Z',
  windowEnd: '2027-03-15T06:00:00Z',
  plannedRounds: 2_000_000,
  profileVersionId: 12,
  profileName: 'Nightly standard',
  profileVersion: 2,
  profileReason: '',
  seedCommitment: '777ddf8cec451a4bdc78edf2e608beeaa3a6b5faa240f5c2edae085b77d51ee6',
  seed: null,
  bookedBy: 'Dev Okafor',
  createdAt: '2027-03-14T08:00:00Z',
  attempts: [],
};

describe('BookNightDialog', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<Host>;
  let loader: HarnessLoader;

  beforeEach(() => {
    // A morning: tonight's window is still ahead.
    jest.useFakeTimers({ now: new Date(2027, 2, 14, 9, 0), advanceTimers: true });
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    http.verify();
    jest.useRealTimers();
  });

  async function openAs(id: number, roles: Role[], plannedRounds: number | null = 2_000_000): Promise<MatDialogHarness> {
    signInAs(roles, { ...SOMEONE, id });
    fixture = TestBed.createComponent(Host);
    loader = TestbedHarnessEnvironment.documentRootLoader(fixture);
    TestBed.inject(MatDialog).open<BookNightDialog, BookNightData>(BookNightDialog, { data: { setup, plannedRounds } });
    await fixture.whenStable();
    http.expectOne('/api/profiles').flush(profiles);
    await fixture.whenStable();
    return loader.getHarness(MatDialogHarness);
  }

  const input = (dialog: MatDialogHarness, testId: string) => dialog.getHarness(MatInputHarness.with({ selector: `[data-testid="${testId}"]` }));
  const profileSelect = (dialog: MatDialogHarness) => dialog.getHarness(MatSelectHarness.with({ selector: '[data-testid="book-profile"]' }));
  const submit = async (dialog: MatDialogHarness) => (await dialog.getHarness(MatButtonHarness.with({ text: 'Book the night' }))).click();

  it('starts from tonight, 20:00 to 06:00, the planner’s rounds and the setup’s profile, and books it', async () => {
    const dialog = await openAs(9, ['experimentalist']);
    // Shown in the browser's date order (jsdom's is en-US).
    expect(await (await input(dialog, 'book-night-date')).getValue()).toBe('3/14/2027');
    expect(await (await input(dialog, 'book-window-start')).getValue()).toBe('2027-03-14T20:00');
    expect(await (await input(dialog, 'book-window-end')).getValue()).toBe('2027-03-15T06:00');
    expect(await (await input(dialog, 'book-rounds')).getValue()).toBe(formatCount(2_000_000));
    const select = await profileSelect(dialog);
    expect(await select.getValueText()).toBe('Nightly standard v2 (the setup’s)');
    expect(await select.isDisabled()).toBe(true);

    await submit(dialog);
    const request = http.expectOne({ method: 'POST', url: '/api/bookings' });
    expect(request.request.body).toEqual({
      setupId: 2,
      night: '2027-03-14',
      windowStart: new Date(2027, 2, 14, 20, 0).toISOString(),
      windowEnd: new Date(2027, 2, 15, 6, 0).toISOString(),
      plannedRounds: 2_000_000,
    });
    request.flush(booking, { status: 201, statusText: 'Created' });
    await fixture.whenStable();

    const text = await dialog.getText();
    expect(text).toContain('The night of Mar 14, 2027 on Fen link is booking 8');
    expect(text).toContain(booking.seedCommitment);
    expect(document.querySelector('[data-testid="booked-setup-link"]')?.getAttribute('href')).toBe('/setups/2');
  });

  it('moves the window with the night, its times as edited', async () => {
    const dialog = await openAs(9, ['experimentalist']);
    await (await input(dialog, 'book-window-start')).setValue('2027-03-14T21:30');
    await (await input(dialog, 'book-night-date')).setValue('3/20/2027');
    expect(await (await input(dialog, 'book-window-start')).getValue()).toBe('2027-03-20T21:30');
    expect(await (await input(dialog, 'book-window-end')).getValue()).toBe('2027-03-21T06:00');
    // The same night again moves nothing.
    await (await input(dialog, 'book-night-date')).setValue('3/20/2027');
    expect(await (await input(dialog, 'book-window-start')).getValue()).toBe('2027-03-20T21:30');
  });

  it('says what is wrong with the window before asking the server', async () => {
    const dialog = await openAs(9, ['experimentalist']);
    await (await input(dialog, 'book-window-end')).setValue('2027-03-17T06:00');
    expect(await dialog.getText()).toContain('A window lasts at most 48 hours.');
    await submit(dialog);
    http.expectNone('/api/bookings');
  });

  it('lets the setup’s shift lead choose another profile, with a reason', async () => {
    const dialog = await openAs(4, ['shift-lead']);
    const select = await profileSelect(dialog);
    expect(await select.isDisabled()).toBe(false);
    await select.open();
    await select.clickOptions({ text: 'Tolerance study v1' });
    await submit(dialog);
    http.expectNone('/api/bookings');
    expect(await dialog.getText()).toContain('Say why this night is judged under another profile than the setup’s.');

    await (await input(dialog, 'book-profile-reason')).setValue('Tolerance study agreed with Sami Virtanen.');
    await submit(dialog);
    const request = http.expectOne({ method: 'POST', url: '/api/bookings' });
    expect(request.request.body).toMatchObject({ profileVersionId: 21, profileReason: 'Tolerance study agreed with Sami Virtanen.' });
    request.flush(
      { error: { code: 'conflict', message: 'The night of 2027-03-14 on Fen link is booked already (booking 7).', field: 'night' } },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    expect(await dialog.getText()).toContain('The night could not be booked. The night of 2027-03-14 on Fen link is booked already (booking 7).');
  });

  it('asks for the rounds when the planner had none', async () => {
    const dialog = await openAs(9, ['experimentalist'], null);
    await submit(dialog);
    http.expectNone('/api/bookings');
    expect(await dialog.getText()).toContain('Write a whole number of rounds');
  });
});
