import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';

import type { LoginResponse } from '@shared/api';
import { Session } from '../auth/session';
import { SignIn } from './sign-in';

const ada: LoginResponse = {
  token: 'token-ada',
  expiresAt: '2027-01-01T06:00:00Z',
  user: {
    id: 7,
    email: 'ada.marsh@kestrelfen.example',
    name: 'Ada Marsh',
    roles: ['experimentalist'],
    active: true,
    createdAt: '2026-11-02T09:00:00Z',
  },
};

describe('SignIn', () => {
  let http: HttpTestingController;
  let navigateByUrl: jest.SpyInstance;

  async function render(returnUrl?: string): Promise<HTMLElement> {
    const fixture = TestBed.createComponent(SignIn);
    if (returnUrl !== undefined) {
      fixture.componentRef.setInput('returnUrl', returnUrl);
    }
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  function type(page: HTMLElement, testId: string, value: string): void {
    const input = page.querySelector<HTMLInputElement>(`[data-testid="${testId}"]`)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
  }

  function submit(page: HTMLElement): void {
    page.querySelector<HTMLButtonElement>('[data-testid="sign-in-submit"]')!.click();
  }

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    navigateByUrl = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
  });

  afterEach(() => http.verify());

  it('signs in, keeps the session and opens the page the user wanted', async () => {
    const page = await render('/users?sort=name');
    type(page, 'sign-in-email', 'ada.marsh@kestrelfen.example');
    type(page, 'sign-in-password', 'north-hall-2026');
    submit(page);

    const request = http.expectOne('/api/auth/login');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({
      email: 'ada.marsh@kestrelfen.example',
      password: 'north-hall-2026',
    });
    request.flush(ada);

    const session = TestBed.inject(Session);
    expect(session.user()).toEqual(ada.user);
    expect(session.token()).toBe('token-ada');
    expect(localStorage.getItem('bellkeep.token')).toBe('token-ada');
    expect(navigateByUrl).toHaveBeenCalledWith('/users?sort=name');
  });

  it('opens the overview when no page was asked for', async () => {
    const page = await render();
    type(page, 'sign-in-email', 'ada.marsh@kestrelfen.example');
    type(page, 'sign-in-password', 'north-hall-2026');
    submit(page);
    http.expectOne('/api/auth/login').flush(ada);

    expect(navigateByUrl).toHaveBeenCalledWith('/');
  });

  it('shows the sentence the API gives when sign-in fails', async () => {
    const fixture = TestBed.createComponent(SignIn);
    await fixture.whenStable();
    const page = fixture.nativeElement as HTMLElement;
    type(page, 'sign-in-email', 'ada.marsh@kestrelfen.example');
    type(page, 'sign-in-password', 'wrong-password');
    submit(page);

    http.expectOne('/api/auth/login').flush({ error: { code: 'unauthorized', message: 'That e-mail and password do not match.' } }, { status: 401, statusText: 'Unauthorized' });
    await fixture.whenStable();

    expect(page.querySelector('[role="alert"]')?.textContent).toContain('That e-mail and password do not match.');
    expect(TestBed.inject(Session).user()).toBeNull();
    expect(localStorage.getItem('bellkeep.token')).toBeNull();
    expect(navigateByUrl).not.toHaveBeenCalled();
  });

  it('asks for a valid e-mail and a password before calling the API', async () => {
    const fixture = TestBed.createComponent(SignIn);
    await fixture.whenStable();
    const page = fixture.nativeElement as HTMLElement;
    type(page, 'sign-in-email', 'ada.marsh');
    submit(page);
    await fixture.whenStable();

    const errors = Array.from(page.querySelectorAll('mat-error'), (error) => error.textContent?.trim());
    expect(errors).toEqual(['Enter an e-mail address such as name@kestrelfen.example.', 'Enter your password.']);
    http.expectNone('/api/auth/login');
  });
});
