import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter, Router } from '@angular/router';

import type { Role } from '@shared/api';
import { Session } from '../auth/session';
import { Shell } from './shell';
import { signInAs } from '../../testing/sign-in-as';

describe('Shell', () => {
  async function renderFor(roles: Role[]): Promise<ComponentFixture<Shell>> {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    signInAs(roles, { id: 5, name: 'Noor Achterberg', email: 'noor.achterberg@kestrelfen.example' });
    const fixture = TestBed.createComponent(Shell);
    await fixture.whenStable();
    return fixture;
  }

  function navLabels(fixture: ComponentFixture<Shell>): string[] {
    const links = (fixture.nativeElement as HTMLElement).querySelectorAll('nav a');
    return Array.from(links, (link) => `${link.getAttribute('data-testid')}: ${link.querySelector('.mat-mdc-list-item-title')?.textContent?.trim()}`);
  }

  /** The workers line asks on a timer (at 0 ms, then every 15 s). */
  const nextTimer = () => new Promise((resolve) => setTimeout(resolve, 0));

  beforeEach(() => localStorage.clear());

  it('shows an admin the planner and the users page', async () => {
    const fixture = await renderFor(['admin']);
    expect(navLabels(fixture)).toEqual([
      'nav-overview: Overview',
      'nav-runs: Runs',
      'nav-planner: Planner',
      'nav-setups: Setups',
      'nav-profiles: Profiles',
      'nav-audit: Audit',
      'nav-users: Users',
      'nav-workers: Workers',
    ]);
  });

  it('tells an admin, above the page, when the analysis workers need them', async () => {
    const fixture = await renderFor(['admin']);
    await nextTimer();
    const attention = 'Analysis workers ended unasked or went silent 4 times in the last hour: one keeps dying.';
    TestBed.inject(HttpTestingController).expectOne('/api/workers').flush({ workers: [], takingJobs: 0, lostInLastHour: 4, waitingRuns: 2, attention });
    await fixture.whenStable();
    const alert = (fixture.nativeElement as HTMLElement).querySelector('[data-testid="workers-alert"]');
    expect(alert?.textContent).toContain(attention);
    expect(alert?.querySelector('a')?.getAttribute('href')).toBe('/workers');
  });

  it('shows no workers line when all is well, and never asks for it for someone who is no admin', async () => {
    const admin = await renderFor(['admin']);
    await nextTimer();
    TestBed.inject(HttpTestingController).expectOne('/api/workers').flush({ workers: [], takingJobs: 1, lostInLastHour: 0, waitingRuns: 0, attention: null });
    await admin.whenStable();
    expect((admin.nativeElement as HTMLElement).querySelector('[data-testid="workers-alert"]')).toBeNull();
    TestBed.resetTestingModule();
    localStorage.clear();

    await renderFor(['shift-lead', 'auditor']);
    await nextTimer();
    TestBed.inject(HttpTestingController).expectNone('/api/workers');
  });

  it('shows a shift lead the planner and hides the users page', async () => {
    const fixture = await renderFor(['shift-lead']);
    expect(navLabels(fixture)).toEqual(['nav-overview: Overview', 'nav-runs: Runs', 'nav-planner: Planner', 'nav-setups: Setups', 'nav-profiles: Profiles']);
  });

  it('signs out from the user menu', async () => {
    const fixture = await renderFor(['auditor']);
    const navigateByUrl = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    const page = fixture.nativeElement as HTMLElement;
    page.querySelector<HTMLButtonElement>('[data-testid="user-menu"]')!.click();
    await fixture.whenStable();
    document.querySelector<HTMLButtonElement>('[data-testid="sign-out"]')!.click();

    expect(TestBed.inject(Session).user()).toBeNull();
    expect(localStorage.getItem('bellkeep.token')).toBeNull();
    expect(navigateByUrl).toHaveBeenCalledWith('/sign-in');
  });

  it('starts with a link that moves the keyboard focus past the bar and the navigation to the page', async () => {
    const fixture = await renderFor(['auditor']);
    const page = fixture.nativeElement as HTMLElement;
    document.body.appendChild(page);
    const skip = page.querySelector<HTMLAnchorElement>('a')!;
    expect(skip.textContent.trim()).toBe('Skip to the page’s content');
    skip.click();
    expect(document.activeElement).toBe(page.querySelector('main'));
    page.remove();
  });

  it('changes your own password from the user menu, and says so once done', async () => {
    const fixture = await renderFor(['auditor']);
    const page = fixture.nativeElement as HTMLElement;
    page.querySelector<HTMLButtonElement>('[data-testid="user-menu"]')!.click();
    await fixture.whenStable();
    document.querySelector<HTMLButtonElement>('[data-testid="change-password"]')!.click();
    await fixture.whenStable();
    const field = (label: string) =>
      Array.from(document.querySelectorAll<HTMLElement>('bk-password-dialog mat-form-field'))
        .find((formField) => formField.querySelector('mat-label')!.textContent.trim() === label)!
        .querySelector('input')!;
    const type = (label: string, value: string) => {
      field(label).value = value;
      field(label).dispatchEvent(new Event('input'));
    };
    type('Current password', 'fen-demo-2026');
    type('New password', 'heron-watch-2027');
    type('New password again', 'heron-watch-2028');
    const submit = document.querySelector<HTMLButtonElement>('bk-password-dialog button[type="submit"]')!;
    submit.click();
    await fixture.whenStable();
    expect(document.querySelector('bk-password-dialog')!.textContent).toContain('The two new passwords differ.');

    type('New password again', 'heron-watch-2027');
    submit.click();
    const request = TestBed.inject(HttpTestingController).expectOne('/api/auth/password');
    expect(request.request.body).toEqual({ currentPassword: 'fen-demo-2026', newPassword: 'heron-watch-2027' });
    request.flush({
      token: 'token-new',
      expiresAt: '2027-03-16T18:00:00Z',
      user: { id: 5, name: 'Noor Achterberg', email: 'noor.achterberg@kestrelfen.example', roles: ['auditor'], active: true, createdAt: '2026-10-01T08:00:00Z' },
    });
    await fixture.whenStable();
    expect(localStorage.getItem('bellkeep.token')).toBe('token-new');
    expect(document.querySelector('bk-password-dialog')).toBeNull();
  });
});
