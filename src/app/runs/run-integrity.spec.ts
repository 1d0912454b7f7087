import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';

import type { ResultSignatureDto, VerificationDto } from '@shared/api';
import { RunIntegrity } from './run-integrity';

const signature: ResultSignatureDto = {
  algorithm: 'Ed25519',
  keyId: '5c1e0a9b7d2f4e38',
  statement: { runId: 12, fileSha256: '9f3a'.repeat(16), fingerprint: 'c07e'.repeat(16), signedAt: '2026-11-19T05:42:10Z' },
  signature: 'c2lnbmVkIGJ5IHRoZSBLZXN0cmVsIEZlbiBzZXJ2ZXI=',
};

const tampered: VerificationDto = {
  runId: 12,
  checkedAt: '2027-03-02T09:15:00Z',
  intact: false,
  checks: [
    { check: 'result-fingerprint', passed: true, detail: 'The stored result hashes to its recorded fingerprint c07ec07e….' },
    { check: 'signature', passed: true, detail: 'The signature verifies with key 5c1e0a9b7d2f4e38.' },
    { check: 'archive-file', passed: false, detail: 'The archived log now hashes to 41d2…, not to the signed 9f3a….' },
    { check: 'system-trail', passed: true, detail: 'The system trail’s hash chain holds: all 1 204 events are linked in order and each still hashes to its link.' },
  ],
};

describe('RunIntegrity', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<RunIntegrity>;

  async function show(stored: ResultSignatureDto | null): Promise<HTMLElement> {
    fixture = TestBed.createComponent(RunIntegrity);
    fixture.componentRef.setInput('runId', 12);
    fixture.componentRef.setInput('signature', stored);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  async function checkNow(host: HTMLElement): Promise<void> {
    host.querySelector<HTMLButtonElement>('[data-testid="check-integrity"]')!.click();
    await fixture.whenStable();
  }

  const text = (host: HTMLElement, testId: string) => host.querySelector(`[data-testid="${testId}"]`)?.textContent?.replace(/\s+/g, ' ').trim();

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('names the signing key and does not re-hash the log until asked', async () => {
    const host = await show(signature);
    expect(text(host, 'signature')).toContain('Signed with Ed25519 key 5c1e0a9b7d2f4e38');
    http.expectNone('/api/runs/12/verification');
    expect(host.querySelector('[data-testid="verification-outcome"]')).toBeNull();
  });

  it('says plainly when the result carries no signature', async () => {
    const host = await show(null);
    expect(text(host, 'signature')).toBe('No signature is stored with this result.');
  });

  it('shows a failed check as “Failed” with its sentence, and the outcome in one line', async () => {
    const host = await show(signature);
    await checkNow(host);
    expect(host.querySelector('[role="status"]')?.textContent).toContain('Re-hashing the archived log');
    http.expectOne('/api/runs/12/verification').flush(tampered);
    await fixture.whenStable();

    const archive = host.querySelector('[data-testid="verification-check-archive-file"]')!;
    // The word beside the icon (never the colour alone), then what was checked and found.
    expect(archive.querySelector('.bk-integrity-word')?.textContent?.replace('cancel', '').trim()).toBe('Failed');
    expect(archive.querySelector('strong')?.textContent).toBe('Archived log');
    expect(archive.querySelector('p')?.textContent).toBe('The archived log now hashes to 41d2…, not to the signed 9f3a….');
    const signatureCheck = host.querySelector('[data-testid="verification-check-signature"]')!;
    expect(signatureCheck.querySelector('.bk-integrity-word')?.textContent?.replace('check_circle', '').trim()).toBe('Intact');
    expect(host.querySelector('[data-testid="verification-check-system-trail"] strong')?.textContent).toBe('System trail');
    expect(text(host, 'verification-outcome')).toMatch(/^gpp_bad ?Failed: 1 of 4 checks failed \(checked Mar 2, 2027, \d\d:15:00 [AP]M (UTC|GMT[+-]\d+(:\d\d)?)\)\.$/);
  });

  it('says Intact when every check passed', async () => {
    const host = await show(signature);
    await checkNow(host);
    http.expectOne('/api/runs/12/verification').flush({ ...tampered, intact: true, checks: tampered.checks.map((check) => ({ ...check, passed: true })) });
    await fixture.whenStable();
    expect(text(host, 'verification-outcome')).toContain('Intact: every check passed');
    expect(host.querySelectorAll('[data-testid^="verification-check-"]')).toHaveLength(4);
  });

  it('gives the server’s sentence when the check cannot be made, and checks again on request', async () => {
    const host = await show(signature);
    await checkNow(host);
    http.expectOne('/api/runs/12/verification').flush({ error: { code: 'conflict', message: 'Run 12 has no stored result to check.' } }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(host.querySelector('[role="alert"]')?.textContent).toContain('The check could not be made. Run 12 has no stored result to check.');

    await checkNow(host);
    http.expectOne('/api/runs/12/verification').flush(tampered);
    await fixture.whenStable();
    expect(host.querySelector('[role="alert"]')).toBeNull();
    expect(text(host, 'verification-outcome')).toContain('Failed: 1 of 4 checks failed');
  });
});
