import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';

import type { UserDto } from '@shared/api';
import { authInterceptor } from './auth-interceptor';
import { Session } from './session';

const bram: UserDto = {
  id: 3,
  email: 'bram.oduya@kestrelfen.example',
  name: 'Bram Oduya',
  roles: ['shift-lead', 'auditor'],
  active: true,
  createdAt: '2026-10-12T08:30:00Z',
};

describe('Session.restore', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([authInterceptor])), provideHttpClientTesting()],
    });
  });

  afterEach(() => http.verify());

  it('asks nothing when no token is kept', () => {
    http = TestBed.inject(HttpTestingController);
    const restored = jest.fn();
    TestBed.inject(Session).restore().subscribe(restored);

    expect(restored).toHaveBeenCalledWith(null);
  });

  it('finds the user of a kept token', () => {
    localStorage.setItem('bellkeep.token', 'token-bram');
    http = TestBed.inject(HttpTestingController);
    const session = TestBed.inject(Session);
    session.restore().subscribe();

    const request = http.expectOne('/api/auth/me');
    expect(request.request.headers.get('Authorization')).toBe('Bearer token-bram');
    request.flush(bram);

    expect(session.user()).toEqual(bram);
    expect(session.hasAnyRole(['admin'])).toBe(false);
    expect(session.hasAnyRole(['admin', 'auditor'])).toBe(true);
  });

  it('forgets a refused token without leaving the page', () => {
    localStorage.setItem('bellkeep.token', 'token-stale');
    http = TestBed.inject(HttpTestingController);
    const navigateByUrl = jest.spyOn(TestBed.inject(Router), 'navigateByUrl');
    const session = TestBed.inject(Session);
    const restored = jest.fn();
    session.restore().subscribe(restored);

    http.expectOne('/api/auth/me').flush({ error: { code: 'unauthorized', message: 'Sign in again.' } }, { status: 401, statusText: 'Unauthorized' });

    expect(restored).toHaveBeenCalledWith(null);
    expect(session.token()).toBeNull();
    expect(localStorage.getItem('bellkeep.token')).toBeNull();
    expect(navigateByUrl).not.toHaveBeenCalled();
  });
});
