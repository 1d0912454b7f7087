import type { HttpTestingController } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';

import type { RunDto, SetupDto, SignOffDto } from '@shared/api';
import { settle } from '../../testing/settle';
import { signInAs, type SpecPerson } from '../../testing/sign-in-as';
import { SignOffPanel } from './sign-off-panel';
import { configureApiTestBed } from '../../testing/dialog-test-bed';

const LUCIA: SpecPerson = { id: 3, name: 'Lucia Brandt', email: 'lucia.brandt@kestrelfen.example' };
const ADA: SpecPerson = { id: 5, name: 'Ada Reyes', email: 'ada.reyes@kestrelfen.example' };
const FEN_LINK = { id: 2, name: 'Fen link', shiftLeads: [ADA, LUCIA] } as unknown as SetupDto;

/** Run 418 of the Fen link, uploaded by Ada, judged `verdict` with a finite key of `keyBits`. */
function runOf(verdict: 'ACCEPT' | 'ABORT', keyBits: number): RunDto {
  return {
    id: 418,
    setupId: 2,
    state: verdict === 'ACCEPT' ? 'accepted' : 'aborted',
    verdict,
    result: { key: { finiteKeyBits: keyBits } },
    uploadedById: ADA.id,
    fourEyes: true,
    signOff: null,
    withdrawal: null,
  } as unknown as RunDto;
}

describe('SignOffPanel', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<SignOffPanel>;
  let host: HTMLElement;
  const text = () => host.textContent.replace(/\s+/g, ' ');

  async function open(person: SpecPerson, run: RunDto): Promise<void> {
    signInAs(['shift-lead', 'experimentalist'], person);
    fixture = TestBed.createComponent(SignOffPanel);
    fixture.componentRef.setInput('run', run);
    fixture.componentRef.setInput('setup', FEN_LINK);
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

  it('tells the shift lead who uploaded the run that another lead signs it off, with no form', async () => {
    await open(ADA, runOf('ACCEPT', 4096));
    expect(host.querySelector('[data-testid="sign-off-form"]')).toBeNull();
    expect(text()).toContain('You uploaded this run. Under the four-eyes rule of Fen link, another shift lead signs it off (Lucia Brandt).');
  });

  it('offers "Key kept" only when there is a key, and sends the decision with the comment', async () => {
    await open(LUCIA, runOf('ACCEPT', 0));
    const keyKept = Array.from(host.querySelectorAll('mat-radio-button')).find((radio) => radio.textContent.includes('Key kept'))!;
    expect(keyKept.querySelector('input')!.disabled).toBe(true);
    expect(text()).toContain('No key can be kept: the finite key is 0 bits at this size.');

    const signed: SignOffDto[] = [];
    fixture.componentInstance.signedOff.subscribe((signOff) => signed.push(signOff));
    const submit = host.querySelector<HTMLButtonElement>('button[type="submit"]')!;
    submit.click();
    await settle(fixture);
    const missing = host.querySelector('[data-testid="decision-missing"]')!;
    expect(missing.getAttribute('role')).toBe('alert');
    expect(missing.textContent).toContain('Choose a decision before signing off.');

    Array.from(host.querySelectorAll<HTMLElement>('mat-radio-button input'))
      .find((input) => input.closest('mat-radio-button')!.textContent.includes('Hardware action needed'))!
      .click();
    const comment = host.querySelector<HTMLTextAreaElement>('textarea')!;
    comment.value = '  Detector B drifts; recool before tonight.  ';
    comment.dispatchEvent(new Event('input'));
    submit.click();
    await settle(fixture);
    const request = http.expectOne('/api/runs/418/sign-off');
    expect(request.request.body).toEqual({ decision: 'hardware-action', comment: 'Detector B drifts; recool before tonight.' });
    const answer: SignOffDto = {
      userId: LUCIA.id,
      userName: LUCIA.name,
      decision: 'hardware-action',
      comment: 'Detector B drifts; recool before tonight.',
      createdAt: '2026-12-05T07:00:00Z',
    };
    request.flush(answer);
    expect(signed).toEqual([answer]);
  });

  it('shows a recorded sign-off with its decision in words', async () => {
    const run = {
      ...runOf('ACCEPT', 4096),
      signOff: { userId: LUCIA.id, userName: LUCIA.name, decision: 'key-kept', comment: 'Steady night.', createdAt: '2026-12-05T07:00:00Z' },
    } as RunDto;
    await open(ADA, run);
    expect(host.querySelector('[data-testid="recorded-sign-off"]')!.textContent).toContain('Key kept');
    expect(text()).toContain('Steady night.');
  });
});
