import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router, UrlTree } from '@angular/router';

import { authInterceptor } from './auth-interceptor';
import { Session } from './session';

describe('authInterceptor', () => {
  let http: HttpTestingController;
  let client: HttpClient;

  function setUp(): void {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([authInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    client = TestBed.inject(HttpClient);
  }

  beforeEach(() => localStorage.clear());
  afterEach(() => http.verify());

  it('adds the bearer token to API requests', () => {
    localStorage.setItem('bellkeep.token', 'token-ada');
    setUp();
    client.get('/api/users').subscribe();

    const request = http.expectOne('/api/users');
    expect(request.request.headers.get('Authorization')).toBe('Bearer token-ada');
    request.flush([]);
  });

  it('sends no token to other addresses', () => {
    localStorage.setItem('bellkeep.token', 'token-ada');
    setUp();
    client.get('/favicon.svg', { responseType: 'text' }).subscribe();

    const request = http.expectOne('/favicon.svg');
    expect(request.request.headers.has('Authorization')).toBe(false);
    request.flush('<svg/>');
  });

  it('sends no header when nobody is signed in', () => {
    setUp();
    client.post('/api/auth/login', {}).subscribe();

    const request = http.expectOne('/api/auth/login');
    expect(request.request.headers.has('Authorization')).toBe(false);
    request.flush({});
  });

  it('on a 401 ends the session and opens sign-in with the page to return to', () => {
    localStorage.setItem('bellkeep.token', 'token-ada');
    setUp();
    const router = TestBed.inject(Router);
    jest.spyOn(router, 'url', 'get').mockReturnValue('/users');
    const navigateByUrl = jest.spyOn(router, 'navigateByUrl').mockResolvedValue(true);
    const failed = jest.fn();
    client.get('/api/users').subscribe({ error: failed });

    http.expectOne('/api/users').flush({ error: { code: 'unauthorized', message: 'Sign in again.' } }, { status: 401, statusText: 'Unauthorized' });

    expect(TestBed.inject(Session).token()).toBeNull();
    expect(localStorage.getItem('bellkeep.token')).toBeNull();
    expect(router.serializeUrl(navigateByUrl.mock.calls[0][0] as UrlTree)).toBe('/sign-in?returnUrl=%2Fusers');
    expect(failed).toHaveBeenCalled();
  });

  it('keeps the session on other errors', () => {
    localStorage.setItem('bellkeep.token', 'token-ada');
    setUp();
    const navigateByUrl = jest.spyOn(TestBed.inject(Router), 'navigateByUrl');
    client.get('/api/users').subscribe({ error: () => undefined });

    http.expectOne('/api/users').flush({ error: { code: 'forbidden', message: 'Admins only.' } }, { status: 403, statusText: 'Forbidden' });

    expect(TestBed.inject(Session).token()).toBe('token-ada');
    expect(navigateByUrl).not.toHaveBeenCalled();
  });
});
