import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';

import { apiErrorMessage } from './api-error-message';
import { attachmentFileName, FileDownloads } from './download';

describe('attachmentFileName', () => {
  it('reads a quoted file name', () => {
    expect(attachmentFileName('attachment; filename="bellkeep-run-12.json"', 'run.json')).toBe('bellkeep-run-12.json');
  });

  it('reads a bare file name and stops at the next parameter', () => {
    expect(attachmentFileName('attachment; filename=run-12.counts.csv; size=2048', 'run.csv')).toBe('run-12.counts.csv');
  });

  it('undoes backslash escapes inside quotes', () => {
    expect(attachmentFileName('attachment; filename="night \\"north\\".pdf"', 'run.pdf')).toBe('night "north".pdf');
  });

  it('prefers the percent-encoded UTF-8 name when both are given', () => {
    expect(attachmentFileName(`attachment; filename="Fen-Nord.pdf"; filename*=UTF-8''Fen-N%C3%B6rd%20night.pdf`, 'run.pdf')).toBe('Fen-Nörd night.pdf');
  });

  it('falls back to the plain name when the encoded one is broken', () => {
    expect(attachmentFileName(`attachment; filename*=UTF-8''%E0%A4%A; filename="run-12.pdf"`, 'run.pdf')).toBe('run-12.pdf');
  });

  it('drops any folder part of the name', () => {
    expect(attachmentFileName('attachment; filename="../../etc/run-12.json"', 'run.json')).toBe('run-12.json');
    expect(attachmentFileName('attachment; filename="C:\\\\reports\\\\run-12.json"', 'run.json')).toBe('run-12.json');
  });

  it('uses the fallback without a header or without a name in it', () => {
    expect(attachmentFileName(null, 'run-12.json')).toBe('run-12.json');
    expect(attachmentFileName('attachment', 'run-12.json')).toBe('run-12.json');
    expect(attachmentFileName('attachment; filename=""', 'run-12.json')).toBe('run-12.json');
  });
});

describe('FileDownloads', () => {
  let http: HttpTestingController;
  let createObjectURL: jest.Mock;
  let revokeObjectURL: jest.Mock;

  beforeAll(() => {
    // jsdom's Blob lacks text(), which every browser Bellkeep supports has: read it the older way.
    if (!('text' in Blob.prototype)) {
      Object.defineProperty(Blob.prototype, 'text', {
        configurable: true,
        value: function (this: Blob) {
          return new Promise<string>((resolve) => {
            const reader = new FileReader();
            reader.onload = () => resolve(reader.result as string);
            reader.readAsText(this);
          });
        },
      });
    }
  });

  beforeEach(() => {
    jest.useFakeTimers();
    // jsdom has no object URLs: stand in for the browser's.
    createObjectURL = jest.fn(() => 'blob:bellkeep/1');
    revokeObjectURL = jest.fn();
    Object.assign(URL, { createObjectURL, revokeObjectURL });
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    http.verify();
    jest.useRealTimers();
  });

  it('saves the answer under the server’s file name through a download link, then frees its URL', async () => {
    const clicked: { href: string; download: string }[] = [];
    const click = jest.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      clicked.push({ href: this.href, download: this.download });
    });
    const saved = firstValueFrom(TestBed.inject(FileDownloads).save('/api/runs/12/export/json', 'run-12.json'));

    const request = http.expectOne('/api/runs/12/export/json');
    expect(request.request.responseType).toBe('blob');
    const body = new Blob(['{"format":"bellkeep.run-report"}'], { type: 'application/json' });
    request.flush(body, { headers: { 'Content-Disposition': 'attachment; filename="bellkeep-run-12-report.json"' } });

    expect(await saved).toBe('bellkeep-run-12-report.json');
    expect(createObjectURL).toHaveBeenCalledWith(body);
    expect(clicked).toEqual([{ href: 'blob:bellkeep/1', download: 'bellkeep-run-12-report.json' }]);
    expect(document.querySelector('a[download]')).toBeNull();
    expect(revokeObjectURL).not.toHaveBeenCalled();
    jest.runAllTimers();
    expect(revokeObjectURL).toHaveBeenCalledWith('blob:bellkeep/1');
    click.mockRestore();
  });

  it('turns a refused download’s JSON error back into the server’s sentence', async () => {
    const saved = firstValueFrom(TestBed.inject(FileDownloads).save('/api/runs/12/export/pdf', 'run-12.pdf'));
    const body = new Blob([JSON.stringify({ error: { code: 'conflict', message: 'Run 12 has no result to export yet.' } })], { type: 'application/json' });
    http.expectOne('/api/runs/12/export/pdf').flush(body, { status: 409, statusText: 'Conflict' });

    await expect(saved.catch((error: unknown) => apiErrorMessage(error))).resolves.toBe('Run 12 has no result to export yet.');
    expect(createObjectURL).not.toHaveBeenCalled();
  });
});
