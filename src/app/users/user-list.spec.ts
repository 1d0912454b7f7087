import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';

import type { UserDto } from '@shared/api';
import { UserList } from './user-list';

const people: UserDto[] = [
  {
    id: 1,
    email: 'ines.halloran@kestrelfen.example',
    name: 'Ines Halloran',
    roles: ['admin'],
    active: true,
    createdAt: '2026-09-01T08:00:00Z',
  },
  {
    id: 2,
    email: 'tomas.reyne@kestrelfen.example',
    name: 'Tomas Reyne',
    roles: ['experimentalist', 'shift-lead'],
    active: true,
    createdAt: '2026-09-14T08:00:00Z',
  },
  {
    id: 3,
    email: 'edda.sorrel@kestrelfen.example',
    name: 'Edda Sorrel',
    roles: ['auditor'],
    active: false,
    createdAt: '2026-10-03T08:00:00Z',
  },
];

describe('UserList', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<UserList>;
  let loader: HarnessLoader;
  let documentLoader: HarnessLoader;

  async function render(): Promise<void> {
    fixture = TestBed.createComponent(UserList);
    loader = TestbedHarnessEnvironment.loader(fixture);
    documentLoader = TestbedHarnessEnvironment.documentRootLoader(fixture);
    await fixture.whenStable();
  }

  async function showList(users: UserDto[]): Promise<void> {
    await render();
    http.expectOne('/api/users').flush(users);
    await fixture.whenStable();
  }

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('lists the users with their roles and state, sorted by name', async () => {
    await showList(people);

    const table = await loader.getHarness(MatTableHarness);
    const rows = await table.getCellTextByColumnName();
    expect(rows['name'].text).toEqual(['Edda Sorrel', 'Ines Halloran', 'Tomas Reyne']);
    expect(rows['roles'].text).toEqual(['Auditor', 'Admin', 'ExperimentalistShift lead']);
    // The state cell starts with its icon's ligature name, then the word.
    expect(rows['active'].text).toEqual(['blockDeactivated', 'check_circleActive', 'check_circleActive']);
    expect(rows['createdAt'].text).toEqual(['Oct 3, 2026', 'Sep 1, 2026', 'Sep 14, 2026']);
  });

  it('says when the list could not be loaded and tries again on request', async () => {
    await render();
    http.expectOne('/api/users').flush({ error: { code: 'internal', message: 'The database is not answering.' } }, { status: 500, statusText: 'Error' });
    await fixture.whenStable();

    const alert = (fixture.nativeElement as HTMLElement).querySelector('[role="alert"]');
    expect(alert?.textContent).toContain('The users could not be loaded. The database is not answering.');

    await (await loader.getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    http.expectOne('/api/users').flush(people);
    await fixture.whenStable();
    expect(await (await loader.getHarness(MatTableHarness)).getRows()).toHaveLength(3);
  });

  describe('new user', () => {
    async function openNewUser(): Promise<MatDialogHarness> {
      await showList(people);
      await (await loader.getHarness(MatButtonHarness.with({ text: /New user/ }))).click();
      return documentLoader.getHarness(MatDialogHarness);
    }

    async function fill(dialog: MatDialogHarness, label: string, value: string): Promise<void> {
      const input = await dialog.getHarness(MatInputHarness.with({ selector: `[formControlName="${label}"]` }));
      await input.setValue(value);
      await input.blur();
    }

    async function submit(dialog: MatDialogHarness): Promise<void> {
      await (await dialog.getHarness(MatButtonHarness.with({ text: 'Add user' }))).click();
    }

    async function errorsOf(dialog: MatDialogHarness): Promise<string[]> {
      const host = await dialog.host();
      const text = await host.text();
      return [
        'Enter the person’s name.',
        'Enter an e-mail address such as name@kestrelfen.example.',
        'The password needs at least 10 characters.',
        'Choose at least one role.',
      ].filter((message) => text.includes(message));
    }

    it('refuses a form without name, with a bad e-mail, a short password and no role', async () => {
      const dialog = await openNewUser();
      await fill(dialog, 'email', 'tomas.reyne');
      await fill(dialog, 'password', 'short');
      await submit(dialog);

      expect(await errorsOf(dialog)).toEqual([
        'Enter the person’s name.',
        'Enter an e-mail address such as name@kestrelfen.example.',
        'The password needs at least 10 characters.',
        'Choose at least one role.',
      ]);
      http.expectNone('/api/users');
    });

    it('adds the user through the API and lists them', async () => {
      const dialog = await openNewUser();
      await fill(dialog, 'name', 'Wren Addo');
      await fill(dialog, 'email', 'wren.addo@kestrelfen.example');
      await fill(dialog, 'password', 'mill-lane-fibre');
      const roles = await dialog.getHarness(MatSelectHarness);
      await roles.open();
      await roles.clickOptions({ text: 'Experimentalist' });
      await submit(dialog);

      const request = http.expectOne('/api/users');
      expect(request.request.method).toBe('POST');
      expect(request.request.body).toEqual({
        name: 'Wren Addo',
        email: 'wren.addo@kestrelfen.example',
        password: 'mill-lane-fibre',
        roles: ['experimentalist'],
      });
      request.flush(
        { id: 4, email: 'wren.addo@kestrelfen.example', name: 'Wren Addo', roles: ['experimentalist'], active: true, createdAt: '2026-12-01T07:00:00Z' },
        { status: 201, statusText: 'Created' },
      );
      await fixture.whenStable();

      expect(await documentLoader.getAllHarnesses(MatDialogHarness)).toHaveLength(0);
      const names = (await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName())['name'].text;
      expect(names).toContain('Wren Addo');
    });

    it('shows the API’s sentence when the e-mail is taken', async () => {
      const dialog = await openNewUser();
      await fill(dialog, 'name', 'Tomas Reyne');
      await fill(dialog, 'email', 'tomas.reyne@kestrelfen.example');
      await fill(dialog, 'password', 'north-hall-night');
      const roles = await dialog.getHarness(MatSelectHarness);
      await roles.open();
      await roles.clickOptions({ text: 'Auditor' });
      await submit(dialog);

      http.expectOne('/api/users').flush({ error: { code: 'conflict', message: 'A user with this e-mail already exists.' } }, { status: 409, statusText: 'Conflict' });
      await fixture.whenStable();

      expect(await (await dialog.host()).text()).toContain('A user with this e-mail already exists.');
    });
  });

  it('changes a user’s roles through the API', async () => {
    await showList(people);
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Actions for Tomas Reyne"]' }))).click();
    const menu = await documentLoader.getHarness(MatMenuHarness.with({ selector: '[aria-label="Actions for Tomas Reyne"]' }));
    await menu.clickItem({ text: /Change name, e-mail or roles/ });
    const dialog = await documentLoader.getHarness(MatDialogHarness);
    const roles = await dialog.getHarness(MatSelectHarness);
    await roles.open();
    await roles.clickOptions({ text: 'Shift lead' });
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Save changes' }))).click();

    const request = http.expectOne('/api/users/2');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ roles: ['experimentalist'] });
    request.flush({ ...people[1], roles: ['experimentalist'] });
    await fixture.whenStable();

    const roleCells = (await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName())['roles'].text;
    expect(roleCells).toEqual(['Auditor', 'Admin', 'Experimentalist']);
  });

  it('changes a user’s name and e-mail in the same dialog, sending only what changed, with no password field', async () => {
    await showList(people);
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Actions for Tomas Reyne"]' }))).click();
    const menu = await documentLoader.getHarness(MatMenuHarness.with({ selector: '[aria-label="Actions for Tomas Reyne"]' }));
    await menu.clickItem({ text: /Change name, e-mail or roles/ });
    const dialog = await documentLoader.getHarness(MatDialogHarness);
    expect(await dialog.getAllHarnesses(MatInputHarness.with({ selector: '[formControlName="password"]' }))).toHaveLength(0);
    const email = await dialog.getHarness(MatInputHarness.with({ selector: '[formControlName="email"]' }));
    await email.setValue('t.reyne@kestrelfen.example');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Save changes' }))).click();

    const request = http.expectOne('/api/users/2');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ email: 't.reyne@kestrelfen.example' });
    request.flush({ ...people[1], email: 't.reyne@kestrelfen.example' });
    await fixture.whenStable();
    expect((await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName())['email'].text).toContain('t.reyne@kestrelfen.example');
  });

  it('deactivates a user only after the admin confirms', async () => {
    await showList(people);
    const trigger = '[aria-label="Actions for Tomas Reyne"]';
    await (await loader.getHarness(MatButtonHarness.with({ selector: trigger }))).click();
    await (await documentLoader.getHarness(MatMenuHarness.with({ selector: trigger }))).clickItem({ text: /Deactivate/ });
    const confirm = await documentLoader.getHarness(MatDialogHarness);
    expect(await confirm.getTitleText()).toBe('Deactivate Tomas Reyne?');
    http.expectNone('/api/users/2');
    await (await confirm.getHarness(MatButtonHarness.with({ text: 'Deactivate' }))).click();

    const request = http.expectOne('/api/users/2');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ active: false });
    request.flush({ ...people[1], active: false });
    await fixture.whenStable();

    const states = (await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName())['active'].text;
    expect(states[2]).toContain('Deactivated');
  });
});
