import type { HttpTestingController } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';

import type { Role, RunDto, WithdrawalDto } from '@shared/api';
import { settle } from '../../testing/settle';
import { signInAs, type SpecPerson } from '../../testing/sign-in-as';
import { RunWithdrawal } from './run-withdrawal';
import { configureApiTestBed } from '../../testing/dialog-test-bed';

const DEV: SpecPerson = { id: 2, name: 'Dev Okafor', email: 'dev.okafor@kestrelfen.example' };
const LUCIA: SpecPerson = { id: 3, name: 'Lucia Brandt', email: 'lucia.brandt@kestrelfen.example' };
const WITHDRAWAL: WithdrawalDto = { userId: 2, userName: 'Dev Okafor', reason: 'Wrong setup: the Reed bench log.', createdAt: '2026-12-03T06:10:00Z' };

/** Run 418, uploaded by Dev (or an upload token when `uploadedById` is null). */
const runOf = (changes: Partial<RunDto> = {}) => ({ id: 418, uploadedById: DEV.id, signOff: null, withdrawal: null, ...changes }) as unknown as RunDto;

describe('RunWithdrawal', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<RunWithdrawal>;
  let host: HTMLElement;
  const text = () => host.textContent.replace(/\s+/g, ' ');
  const button = () => host.querySelector<HTMLButtonElement>('[data-testid="withdraw-button"]');

  async function open(roles: Role[], person: SpecPerson, run: RunDto): Promise<void> {
    signInAs(roles, person);
    fixture = TestBed.createComponent(RunWithdrawal);
    fixture.componentRef.setInput('run', run);
    host = fixture.nativeElement as HTMLElement;
    await settle(fixture);
  }

  beforeEach(() => {
    jest.useFakeTimers();
    http = configureApiTestBed();
  });

  afterEach(() => {
    http.verify();
    jest.useRealTimers();
  });

  it('lets the uploader withdraw with a reason, asked for before anything is sent', async () => {
    await open(['experimentalist'], DEV, runOf());
    const withdrawn: WithdrawalDto[] = [];
    fixture.componentInstance.withdrawn.subscribe((withdrawal) => withdrawn.push(withdrawal));
    button()!.click();
    await settle(fixture);
    host.querySelector<HTMLButtonElement>('[data-testid="withdraw-confirm"]')!.click();
    await settle(fixture);
    expect(text()).toContain('Say why the upload is withdrawn.');

    const reason = host.querySelector<HTMLTextAreaElement>('[data-testid="withdraw-reason"]')!;
    reason.value = '  Wrong setup: the Reed bench log.  ';
    reason.dispatchEvent(new Event('input'));
    host.querySelector<HTMLButtonElement>('[data-testid="withdraw-confirm"]')!.click();
    const request = http.expectOne('/api/runs/418/withdraw');
    expect(request.request.body).toEqual({ reason: 'Wrong setup: the Reed bench log.' });
    request.flush(WITHDRAWAL);
    await settle(fixture);
    expect(withdrawn).toEqual([WITHDRAWAL]);
  });

  it('offers nothing to another shift lead, nor once the run is signed off', async () => {
    await open(['shift-lead'], LUCIA, runOf());
    expect(button()).toBeNull();
    fixture.componentRef.setInput('run', runOf({ signOff: { userId: 3, userName: 'Lucia Brandt', decision: 'key-discarded', comment: 'ok', createdAt: '2026-12-03T07:00:00Z' } }));
    await settle(fixture);
    expect(button()).toBeNull();
  });

  it('lets any experimentalist withdraw a log an upload token sent', async () => {
    await open(['experimentalist'], LUCIA, runOf({ uploadedById: null }));
    expect(button()).not.toBeNull();
  });

  it('shows who withdrew the upload, when and why, to everyone', async () => {
    await open(['auditor'], LUCIA, runOf({ withdrawal: WITHDRAWAL }));
    expect(text()).toContain('Upload withdrawn by Dev Okafor on Dec 3, 2026');
    expect(text()).toContain('Wrong setup: the Reed bench log.');
    expect(button()).toBeNull();
  });
});
