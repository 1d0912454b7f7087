import type { HttpTestingController } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatSelectHarness } from '@angular/material/select/testing';

import type { ProfileDto, UserDto } from '@shared/api';
import { configureDialogTestBed } from '../../testing/dialog-test-bed';
import { SetupDialog, type SetupDialogData } from './setup-dialog';
import { specSetup } from '../../testing/spec-setup';

const heronReach = specSetup({
  name: 'Heron Reach link',
  description: 'North hall to the boathouse',
  stationALabel: 'North hall',
  stationBLabel: 'Boathouse',
  shiftLeads: [{ id: 3, name: 'Lucia Brandt', email: 'lucia.brandt@kestrelfen.example' }],
  extraRecipients: ['night-desk@kestrelfen.example'],
});

const profile = (id: number, name: string): ProfileDto => ({ id, name, description: '', latestVersionId: id * 10, createdAt: '2026-11-01T08:00:00Z', versions: [] });
const person = (id: number, name: string, roles: UserDto['roles'], active = true): UserDto => ({
  id,
  name,
  email: `${name.toLowerCase().replace(' ', '.')}@kestrelfen.example`,
  roles,
  active,
  createdAt: '2026-10-01T08:00:00Z',
});

describe('SetupDialog', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<SetupDialog>;
  let host: HTMLElement;
  const close = jest.fn<void, [unknown]>();

  async function open(data: SetupDialogData): Promise<void> {
    close.mockReset();
    http = configureDialogTestBed(data, close);
    fixture = TestBed.createComponent(SetupDialog);
    host = fixture.nativeElement as HTMLElement;
    fixture.detectChanges();
    http.expectOne('/api/profiles').flush([profile(1, 'Nightly standard'), profile(2, 'Calibration')]);
    http
      .expectOne('/api/users')
      .flush([
        person(3, 'Lucia Brandt', ['shift-lead']),
        person(4, 'Ada Reyes', ['experimentalist', 'shift-lead']),
        person(5, 'Sami Virtanen', ['auditor']),
        person(6, 'Old Lead', ['shift-lead'], false),
      ]);
    await fixture.whenStable();
  }

  async function type(field: string, value: string): Promise<void> {
    const input = host.querySelector<HTMLInputElement>(`input[formcontrolname="${field}"]`)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
    await fixture.whenStable();
  }

  async function submit(): Promise<void> {
    host.ownerDocument.querySelector<HTMLFormElement>('#bk-setup-form')!.dispatchEvent(new Event('submit'));
    await fixture.whenStable();
  }

  afterEach(() => http.verify());

  it('edits a setup: filled in, a wrong recipient refused before anything is sent, then saved trimmed and closed with the answer', async () => {
    await open({ setup: heronReach });
    expect(host.querySelector('h2')!.textContent).toBe('Edit Heron Reach link');
    expect(host.querySelector<HTMLInputElement>('input[formcontrolname="stationALabel"]')!.value).toBe('North hall');
    expect(host.querySelector<HTMLInputElement>('input[formcontrolname="extraRecipients"]')!.value).toBe('night-desk@kestrelfen.example');

    await type('extraRecipients', 'night-desk@kestrelfen.example, boathouse-desk');
    await submit();
    expect(host.textContent).toContain('“boathouse-desk” is not an e-mail address.');

    await type('extraRecipients', 'night-desk@kestrelfen.example,  boathouse@kestrelfen.example ');
    await type('stationBLabel', '  Boathouse east ');
    // The four-eyes rule, on for this setup, is turned off.
    host.querySelector<HTMLInputElement>('mat-checkbox input')!.click();
    // Where the stations are: a clock offset alone is refused until its uncertainty is given.
    await type('stationDistanceM', '1200');
    await type('clockOffsetNs', '-12.5');
    await submit();
    expect(host.textContent).toContain('Give the clock offset and its uncertainty together, or neither.');
    http.expectNone({ method: 'PUT', url: '/api/setups/2' });
    await type('clockUncertaintyNs', '0.8');
    await submit();
    const put = http.expectOne({ method: 'PUT', url: '/api/setups/2' });
    expect(put.request.body).toEqual({
      name: 'Heron Reach link',
      description: 'North hall to the boathouse',
      stationALabel: 'North hall',
      stationBLabel: 'Boathouse east',
      defaultProfileId: 1,
      shiftLeadIds: [3],
      extraRecipients: ['night-desk@kestrelfen.example', 'boathouse@kestrelfen.example'],
      fourEyes: false,
      stationDistanceM: 1200,
      clockOffsetNs: -12.5,
      clockUncertaintyNs: 0.8,
    });
    const saved = { ...heronReach, stationBLabel: 'Boathouse east' };
    put.flush(saved);
    await fixture.whenStable();
    expect(close).toHaveBeenCalledWith(saved);
  });

  it('adds a setup: offers only active shift leads, needs a name and a profile, and shows the server’s refusal without closing', async () => {
    await open({ setup: null });
    expect(host.querySelector('h2')!.textContent).toBe('New setup');
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const leads = await loader.getHarness(MatSelectHarness.with({ selector: '[formcontrolname="shiftLeadIds"]' }));
    await leads.open();
    expect(await Promise.all((await leads.getOptions()).map((option) => option.getText()))).toEqual([
      'Lucia Brandt · lucia.brandt@kestrelfen.example',
      'Ada Reyes · ada.reyes@kestrelfen.example',
    ]);
    await leads.clickOptions({ text: /Ada Reyes/ });
    await leads.close();

    await submit();
    expect(host.textContent).toContain('Enter the setup’s name.');

    await type('name', 'Mill Lane link');
    await type('stationALabel', 'Mill');
    await type('stationBLabel', 'Lane');
    const profiles = await loader.getHarness(MatSelectHarness.with({ selector: '[formcontrolname="defaultProfileId"]' }));
    await profiles.open();
    await profiles.clickOptions({ text: 'Calibration' });
    await submit();
    const post = http.expectOne({ method: 'POST', url: '/api/setups' });
    expect(post.request.body).toMatchObject({ name: 'Mill Lane link', defaultProfileId: 2, shiftLeadIds: [4], extraRecipients: [], fourEyes: true });
    post.flush({ error: { code: 'conflict', message: 'A setup named Mill Lane link exists already.' } }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    fixture.detectChanges();
    expect(host.querySelector('[role="alert"]')!.textContent).toContain('A setup named Mill Lane link exists already.');
    expect(close).not.toHaveBeenCalled();
    expect(host.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(false);
  });

  it('closes with no result on Cancel, so the list behind it does nothing', async () => {
    await open({ setup: heronReach });
    Array.from(host.ownerDocument.querySelectorAll<HTMLButtonElement>('button'))
      .find((button) => button.textContent.trim() === 'Cancel')!
      .click();
    expect(close).toHaveBeenCalledTimes(1);
    expect(close.mock.calls[0][0]).toBeUndefined();
  });
});
