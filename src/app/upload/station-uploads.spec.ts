import { Subject, throwError } from 'rxjs';

import type { RunDto, StationLogDto } from '@shared/api';
import type { UploadProgress } from './resumable-uploads';
import { arrivalSentence, sendStationLogs, type StationLogUpload, type StationUploadProgress } from './station-uploads';
import type { LogUpload } from './upload-metadata';

const fields = { setupId: 2, mapping: { columns: {}, outcomes: '0/1' as const }, bookingId: null, replacementReason: '', acquiredOn: '2027-03-14', notes: '' };
const stationA: StationLogUpload = { ...fields, station: 'A', log: new File(['x'.repeat(300)], 'north-hall.csv') };
const stationB: StationLogUpload = { ...fields, station: 'B', log: new File(['y'.repeat(100)], 'mill-lane.csv') };

describe('sendStationLogs', () => {
  it('sends station A’s log, then B’s, telling the share of all bytes and what each made', () => {
    const uploads = new Map<string, Subject<UploadProgress>>();
    const sent: LogUpload[] = [];
    const send = (log: LogUpload) => {
      sent.push(log);
      const subject = new Subject<UploadProgress>();
      uploads.set(log.log.name, subject);
      return subject;
    };
    const seen: StationUploadProgress[] = [];
    sendStationLogs(send, [stationA, stationB]).subscribe((progress) => seen.push(progress));

    // B's upload starts only once A's has ended.
    expect(sent.map((log) => log.station)).toEqual(['A']);
    const waiting = { id: 5, station: 'A', runId: null } as StationLogDto;
    uploads.get('north-hall.csv')!.next({ kind: 'sending', fraction: 0.5 });
    uploads.get('north-hall.csv')!.next({ kind: 'waiting', stationLog: waiting });
    uploads.get('north-hall.csv')!.complete();
    expect(sent.map((log) => log.station)).toEqual(['A', 'B']);

    const run = { id: 43 } as RunDto;
    uploads.get('mill-lane.csv')!.next({ kind: 'sending', fraction: 0.5 });
    uploads.get('mill-lane.csv')!.next({ kind: 'done', run });
    uploads.get('mill-lane.csv')!.complete();

    expect(seen).toEqual([
      { kind: 'sending', fraction: 150 / 400 },
      { kind: 'arrived', station: 'A', arrival: { kind: 'waiting', stationLog: waiting } },
      { kind: 'sending', fraction: 350 / 400 },
      { kind: 'arrived', station: 'B', arrival: { kind: 'done', run } },
    ]);
  });

  it('stops at a refusal: the logs after it are not sent', () => {
    const sent: string[] = [];
    let failure: unknown = null;
    sendStationLogs(
      (log) => {
        sent.push(log.log.name);
        return throwError(() => new Error('refused'));
      },
      [stationA, stationB],
    ).subscribe({ error: (error: unknown) => (failure = error) });
    expect(sent).toEqual(['north-hall.csv']);
    expect((failure as Error).message).toBe('refused');
  });
});

describe('arrivalSentence', () => {
  it('says whether the night waits for the other station’s log or is a run now', () => {
    expect(arrivalSentence('A', { kind: 'waiting', stationLog: { id: 5 } as StationLogDto })).toBe('Station A’s log is in; the night waits for station B’s.');
    expect(arrivalSentence('B', { kind: 'done', run: { id: 43 } as RunDto })).toBe('Station B’s log is in and joins station A’s: the night is run 43.');
  });
});
