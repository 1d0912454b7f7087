import { HttpErrorResponse, provideHttpClient } from '@angular/common/http';
import { DateTime } from 'luxon';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { By } from '@angular/platform-browser';
import { provideRouter, Router } from '@angular/router';
import { Subject } from 'rxjs';

import type { BookingDto, ProfileDto, RunDto, SetupDto, StationLogDto } from '@shared/api';
import { ResumableUploads, type UploadProgress } from './resumable-uploads';
import type { LogUpload } from './upload-metadata';
import { StationLogPicker } from './station-log-picker';
import { UploadPage } from './upload-page';
import { specSetup } from '../../testing/spec-setup';

const setups: SetupDto[] = [
  specSetup(),
  specSetup({
    id: 3,
    name: 'Mill Lane bench',
    columnMapping: { columns: { round: 'RoundNo', x: 'SetNorth', y: 'SetMill', a: 'OutNorth', b: 'OutMill' }, outcomes: '±1' },
  }),
];

const MILL_LANE_LOG = 'RoundNo,SetNorth,SetMill,OutNorth,OutMill\n1,0,1,+1,-1\n2,1,1,-1,-1\n';

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
];

const hour = 3_600_000;
/** A booking of last night, its window closed two hours ago; with a log as run 41 when `runIds` says so. */
function lastNight(runIds: number[] = []): BookingDto {
  return {
    id: 7,
    setupId: 2,
    setupName: 'Fen link',
    night: '2027-03-14',
    windowStart: new Date(Date.now() - 12 * hour).toISOString(),
    windowEnd: new Date(Date.now() - 2 * hour).toISOString(),
    plannedRounds: 2_000_000,
    profileVersionId: 11,
    profileName: 'Nightly standard',
    profileVersion: 1,
    profileReason: 'Tolerance kept from last week.',
    seedCommitment: '777ddf8cec451a4bdc78edf2e608beeaa3a6b5faa240f5c2edae085b77d51ee6',
    seed: null,
    bookedBy: 'Dev Okafor',
    createdAt: '2027-03-14T08:00:00Z',
    attempts: runIds.map((runId, index) => ({ runId, attempt: index + 1, state: 'aborted', verdict: 'ABORT', replacementReason: '', createdAt: '2027-03-15T06:00:00Z' })),
  };
}

const LOG = 'round,x,y,a,b\n1,0,1,0,0\n2,1,1,1,0\n3,0,0,1,1\n';

describe('UploadPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<UploadPage>;
  let loader: HarnessLoader;
  let host: HTMLElement;
  let sent: LogUpload[];
  let progress: Subject<UploadProgress>;

  beforeEach(async () => {
    sent = [];
    const uploads: Pick<ResumableUploads, 'send'> = {
      // Each upload reports through its own subject; `progress` is the latest one's.
      send: (log) => {
        sent.push(log);
        progress = new Subject();
        return progress;
      },
    };
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
        { provide: ResumableUploads, useValue: uploads },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(UploadPage);
    loader = TestbedHarnessEnvironment.loader(fixture);
    host = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    http.expectOne('/api/setups').flush(setups);
    http.expectOne('/api/profiles').flush(profiles);
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  const select = (testId: string) => loader.getHarness(MatSelectHarness.with({ selector: `[data-testid="${testId}"]` }));
  const text = (testId: string) => host.querySelector(`[data-testid="${testId}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? '';

  /** Chooses Fen link, answers its bookings, and picks the log. */
  async function prepare(bookings: BookingDto[], log = LOG, setupName = 'Fen link'): Promise<void> {
    const setup = await select('setup-select');
    await setup.open();
    await setup.clickOptions({ text: setupName });
    http.expectOne(`/api/bookings?setupId=${setups.find((candidate) => candidate.name === setupName)!.id}`).flush(bookings);
    await fixture.whenStable();
    await (fixture.componentInstance as unknown as { chooseLog(file: File): Promise<void> }).chooseLog(new File([log], 'night-14.csv'));
    await fixture.whenStable();
  }

  const clickUpload = async () => {
    host.querySelector<HTMLButtonElement>('[data-testid="upload-button"]')!.click();
    await fixture.whenStable();
  };

  it('joins the booking open now, judged under its profile on its night', async () => {
    await prepare([lastNight()]);
    const booking = await select('booking-select');
    expect(await booking.getValueText()).toBe('Night of Mar 14, 2027 (booking 7)');
    expect(await (await select('profile-select')).getValueText()).toBe('Nightly standard v1');
    expect(host.querySelector<HTMLInputElement>('[data-testid="acquired-on"]')?.disabled).toBe(true);
    expect(host.querySelector('[data-testid="replacement"]')).toBeNull();

    // A double click: the second lands before the page shows the upload, and sends nothing.
    const button = host.querySelector<HTMLButtonElement>('[data-testid="upload-button"]')!;
    button.click();
    button.click();
    await fixture.whenStable();
    expect(sent).toHaveLength(1);
    expect(sent[0]).toMatchObject({ setupId: 2, bookingId: 7, replacementReason: '', acquiredOn: '' });

    progress.next({ kind: 'sending', fraction: 0.5 });
    await fixture.whenStable();
    expect(host.querySelector('[data-testid="upload-progress"]')?.getAttribute('aria-valuenow')).toBe('50');
    progress.next({
      kind: 'done',
      run: { id: 42, state: 'queued', progress: 0, result: null, error: null, file: { originalName: 'night-14.csv' }, stations: null } as unknown as RunDto,
    });
    progress.complete();
    await fixture.whenStable();
    // The run exists: it can be opened at once, and the address names it, so a reload comes back to it.
    expect(text('open-run')).toContain('Open run 42');
    expect(TestBed.inject(Router).url).toBe('/?run=42');
    // The analysis is followed by polling, whose first request waits for a timer.
    await new Promise((resolve) => setTimeout(resolve, 0));
    http.expectOne('/api/runs/42').flush({ id: 42, state: 'accepted', progress: 1, result: null, error: null, file: { originalName: 'night-14.csv' }, stations: null });
    await fixture.whenStable();
    expect(text('open-run')).toContain('Open run 42');
    expect(host.querySelector('[data-testid="open-run"]')?.getAttribute('href')).toBe('/runs/42');
  });

  it('comes back to the run being analysed when the page is opened again with it in the address', async () => {
    await TestBed.inject(Router).navigateByUrl('/?run=42');
    const reopened = TestBed.createComponent(UploadPage);
    await reopened.whenStable();
    http.expectOne('/api/setups').flush(setups);
    http.expectOne('/api/profiles').flush(profiles);
    await new Promise((resolve) => setTimeout(resolve, 0));
    http.expectOne('/api/runs/42').flush({ id: 42, state: 'analysing', progress: 0.3, result: null, error: null, file: { originalName: 'night-14.csv' } });
    await reopened.whenStable();
    const page = reopened.nativeElement as HTMLElement;
    expect(page.querySelector('#bk-upload-progress-title')!.textContent).toBe('night-14.csv');
    expect(page.querySelector('[data-testid="open-run"]')!.textContent).toContain('Open run 42');
    reopened.destroy();
  });

  it('asks why, and says which attempt it will be, when the night has a log already', async () => {
    await prepare([lastNight([41])]);
    expect(text('replacement')).toContain('This night already has run 41 (attempt 1); this upload will be attempt 2.');

    await clickUpload();
    expect(sent).toHaveLength(0);
    expect(text('replacement')).toContain('Say why the night’s log is replaced.');

    const reason = host.querySelector<HTMLTextAreaElement>('[data-testid="replacement-reason"]')!;
    reason.value = 'Detector B was saturated; log re-read from the second disk.';
    reason.dispatchEvent(new Event('input'));
    await clickUpload();
    expect(sent[0]).toMatchObject({ bookingId: 7, replacementReason: 'Detector B was saturated; log re-read from the second disk.' });
  });

  it('offers "unbooked" only when no booking is open, and says what that means', async () => {
    await prepare([]);
    const booking = await select('booking-select');
    await booking.open();
    expect(await Promise.all((await booking.getOptions()).map((option) => option.getText()))).toEqual(['No booking (unbooked)']);
    await booking.close();
    expect(text('unbooked-hint')).toContain('No booking is open: the run will be unbooked');
    expect(await (await select('profile-select')).getValueText()).toBe('Nightly standard v2');

    const acquiredOn = host.querySelector<HTMLInputElement>('[data-testid="acquired-on"]')!;
    expect(acquiredOn.disabled).toBe(false);
    // Typed in the browser's date order (jsdom's is en-US).
    acquiredOn.value = '3/10/2026';
    acquiredOn.dispatchEvent(new Event('input'));
    await clickUpload();
    expect(sent[0]).toMatchObject({ bookingId: null, acquiredOn: '2026-03-10' });
  });

  it('refuses an acquisition date in the future, saying so under the field', async () => {
    await prepare([]);
    const acquiredOn = host.querySelector<HTMLInputElement>('[data-testid="acquired-on"]')!;
    const tomorrow = DateTime.now().plus({ days: 1 });
    acquiredOn.value = tomorrow.toFormat('M/d/yyyy');
    acquiredOn.dispatchEvent(new Event('input'));
    await clickUpload();
    expect(sent).toEqual([]);
    expect(host.querySelector('mat-error')?.textContent).toContain('A log is acquired on or before today: the date is in the future.');
  });

  it('refuses to send a log whose preview shows rows that break the log rules', async () => {
    await prepare([lastNight()], 'round,x,y,a,b\n1,0,1,0,0\n2,1,7,1,0\n');
    expect(text('preview-status')).toContain('1 of the first 2 rows break the log rules, so no verdict would be possible (INVALID)');
    expect(host.querySelector<HTMLButtonElement>('[data-testid="upload-button"]')!.disabled).toBe(true);
    await clickUpload();
    expect(sent).toHaveLength(0);
  });

  it('starts from the setup’s saved mapping when the header fits it, and from the header’s guess when not', async () => {
    await prepare([], MILL_LANE_LOG, 'Mill Lane bench');
    expect(text('mapping-note')).toContain('Filled in from the mapping saved for Mill Lane bench.');
    expect(await (await select('mapping-outcomes')).getValueText()).toBe('±1 (+1 → 0, −1 → 1)');
    expect(text('mapping-saved')).toContain('This is the mapping saved for Mill Lane bench.');
    expect(text('preview-status')).toContain('The first 2 rows read cleanly under this mapping.');

    await (fixture.componentInstance as unknown as { chooseLog(file: File): Promise<void> }).chooseLog(new File([LOG], 'night-15.csv'));
    await fixture.whenStable();
    expect(text('mapping-note')).toContain('The mapping saved for Mill Lane bench does not fit this file (the header has no column "RoundNo"');
    expect(text('preview-status')).toContain('The first 3 rows read cleanly under this mapping.');
  });

  it('saves the mapping on screen for the setup', async () => {
    await prepare([lastNight()]);
    expect(text('mapping-note')).toContain('Filled in from the header.');
    host.querySelector<HTMLButtonElement>('[data-testid="save-mapping"]')!.click();
    const saved = http.expectOne('/api/setups/2/column-mapping');
    expect(saved.request.method).toBe('PUT');
    const mapping = { columns: { round: 'round', x: 'x', y: 'y', a: 'a', b: 'b' }, outcomes: '0/1' };
    expect(saved.request.body).toEqual({ mapping });
    saved.flush({ ...setups[0], columnMapping: mapping });
    await fixture.whenStable();
    expect(text('mapping-saved')).toContain('This is the mapping saved for Fen link.');
  });

  it('shows the server’s refusal and lets the user try again', async () => {
    await prepare([lastNight()]);
    await clickUpload();
    const message = 'These bytes are already run 40: a log is judged once, under one seed. Upload the night’s own log.';
    progress.error(new HttpErrorResponse({ status: 409, error: { error: { code: 'conflict', message } } }));
    await fixture.whenStable();
    expect(text('upload-failure')).toBe(`The upload was refused. ${message}`);
    expect(host.querySelector('[data-testid="upload-button"]')).not.toBeNull();
  });

  describe('with two station logs', () => {
    const STATION_A_LOG = 'round,x,a,t_setting,t_outcome\n1,0,1,1000,2000\n2,1,0,5000,6000\n';
    const STATION_B_LOG = 'round,y,b\n1,1,+1\n2,0,-1\n';

    /** Chooses Fen link with `bookings`, and "Two station logs". */
    async function chooseStations(bookings: BookingDto[]): Promise<void> {
      const setup = await select('setup-select');
      await setup.open();
      await setup.clickOptions({ text: 'Fen link' });
      http.expectOne('/api/bookings?setupId=2').flush(bookings);
      await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'Two station logs' }))).check();
      await fixture.whenStable();
    }

    /** Picks `text` as the log of the picker of `station`. */
    async function pickStationLog(station: 'A' | 'B', text: string, name: string): Promise<void> {
      const pickers = fixture.debugElement.queryAll(By.directive(StationLogPicker)).map((picker) => picker.componentInstance as StationLogPicker);
      await pickers.find((picker) => picker.station() === station)!.chooseLog(new File([text], name));
      await fixture.whenStable();
    }

    const waiting = (station: 'A' | 'B') => ({ id: 5, station, runId: null }) as StationLogDto;

    it('names each picker by the setup’s station and checks each file against its station’s columns', async () => {
      await chooseStations([lastNight()]);
      expect(host.querySelector('#station-a-title')?.textContent).toBe('Station A · North Hall');
      expect(host.querySelector('#station-b-title')?.textContent).toBe('Station B · Mill Lane');
      expect(text('stations-refusal')).toBe('Choose station A’s log, station B’s, or both.');

      await pickStationLog('A', STATION_B_LOG, 'mill-lane.csv');
      expect(text('station-a-check')).toContain('This is not station A\'s log as Bellkeep reads it: the header has no column "x" for the station A setting');
      expect(text('station-a-check')).toContain("Station A's log has the columns round, x, a (and t_setting, t_outcome, both or neither).");
      expect(host.querySelector<HTMLButtonElement>('[data-testid="upload-button"]')!.disabled).toBe(true);
      // No joined-log columns to map for station logs.
      expect(host.querySelector('[data-testid="mapping"]')).toBeNull();
    });

    it('sends one station’s log alone with its station, needing the night when unbooked, and says the night waits for the other’s', async () => {
      await chooseStations([]);
      await pickStationLog('A', STATION_A_LOG, 'north-hall.csv');
      expect(text('station-a-check')).toBe('check_circleThe header fits station A’s columns. All 2 rows read cleanly (rounds 1 to 2), with times; outcomes written 0/1.');
      expect(text('waits-note')).toContain('Only station A’s log is given: it is kept, and the night waits for station B’s log (Mill Lane)');
      expect(text('upload-button')).toContain('Upload station A’s log');

      await clickUpload();
      expect(sent).toHaveLength(0);
      expect(host.textContent).toContain('Give the night: unbooked station logs pair by setup and night.');
      const acquiredOn = host.querySelector<HTMLInputElement>('[data-testid="acquired-on"]')!;
      acquiredOn.value = '3/14/2026';
      acquiredOn.dispatchEvent(new Event('input'));
      await clickUpload();
      expect(sent).toHaveLength(1);
      expect(sent[0]).toMatchObject({ station: 'A', setupId: 2, bookingId: null, acquiredOn: '2026-03-14', mapping: { columns: {}, outcomes: '0/1' } });
      expect(sent[0].log.name).toBe('north-hall.csv');

      progress.next({ kind: 'waiting', stationLog: waiting('A') });
      progress.complete();
      await fixture.whenStable();
      expect(text('arrival')).toBe('hourglass_topStation A’s log is in; the night waits for station B’s.');
      expect(text('night-waits')).toContain('The run is made when station B’s log (Mill Lane) of the same night comes');
      expect(host.querySelector('[data-testid="open-run"]')).toBeNull();
    });

    it('sends station A’s log, then B’s (outcomes ±1 for both), and opens the run the pair made', async () => {
      await chooseStations([lastNight()]);
      const signedA = 'round,x,a\n1,0,+1\n2,1,-1\n';
      await pickStationLog('A', signedA, 'north-hall.csv');
      await pickStationLog('B', STATION_B_LOG, 'mill-lane.csv');
      expect(host.querySelector('[data-testid="waits-note"]')).toBeNull();
      await clickUpload();
      expect(sent.map((log) => log.station)).toEqual(['A']);
      expect(sent[0]).toMatchObject({ bookingId: 7, acquiredOn: '', mapping: { columns: {}, outcomes: '±1' } });

      progress.next({ kind: 'waiting', stationLog: waiting('A') });
      progress.complete();
      await fixture.whenStable();
      expect(sent.map((log) => log.station)).toEqual(['A', 'B']);
      const run = {
        id: 43,
        state: 'queued',
        progress: 0,
        result: null,
        error: null,
        file: { originalName: 'north-hall.csv' },
        stations: { stationB: { originalName: 'mill-lane.csv' } },
      };
      progress.next({ kind: 'done', run: run as unknown as RunDto });
      progress.complete();
      await fixture.whenStable();
      expect(Array.from(host.querySelectorAll('[data-testid="arrival"]'), (line) => line.textContent.replace(/\s+/g, ' ').trim())).toEqual([
        'hourglass_topStation A’s log is in; the night waits for station B’s.',
        'mergeStation B’s log is in and joins station A’s: the night is run 43.',
      ]);
      expect(host.querySelector('#bk-upload-progress-title')!.textContent).toBe('north-hall.csv and mill-lane.csv');
      expect(text('open-run')).toContain('Open run 43');
      await new Promise((resolve) => setTimeout(resolve, 0));
      http.expectOne('/api/runs/43').flush({ ...run, state: 'invalid', verdict: 'INVALID' });
      await fixture.whenStable();
    });

    it('refuses logs whose outcomes are written two ways', async () => {
      await chooseStations([lastNight()]);
      await pickStationLog('A', STATION_A_LOG, 'north-hall.csv');
      await pickStationLog('B', STATION_B_LOG, 'mill-lane.csv');
      expect(text('stations-refusal')).toContain('a night’s two logs are read one way');
      await clickUpload();
      expect(sent).toHaveLength(0);
    });
  });
});
