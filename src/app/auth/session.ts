import { HttpClient, HttpContext, HttpContextToken, HttpErrorResponse } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import { catchError, map, Observable, of, tap } from 'rxjs';

import type { ChangePasswordRequest, LoginRequest, LoginResponse, Role, UserDto } from '@shared/api';

/** Where the bearer token is kept between visits. */
const TOKEN_KEY = 'bellkeep.token';

/**
 * Whether a 401 on this request means the session has ended and the user must sign in again.
 * Off for the start-up check of a kept token, which clears a stale token itself.
 */
export const ENDS_SESSION_ON_401 = new HttpContextToken<boolean>(() => true);

/** The signed-in user and their token; the client of the API's auth area. */
@Injectable({ providedIn: 'root' })
export class Session {
  private readonly http = inject(HttpClient);
  private readonly currentToken = signal<string | null>(localStorage.getItem(TOKEN_KEY));
  private readonly currentUser = signal<UserDto | null>(null);

  /** The bearer token, or null when nobody is signed in. */
  readonly token = this.currentToken.asReadonly();

  /** The signed-in user, or null. */
  readonly user = this.currentUser.asReadonly();

  /** The roles of the signed-in user; none when nobody is signed in. */
  readonly roles = computed<readonly Role[]>(() => this.currentUser()?.roles ?? []);

  /** Signs in with e-mail and password and keeps the token for later visits. */
  signIn(credentials: LoginRequest): Observable<UserDto> {
    return this.keep(this.http.post<LoginResponse>('/api/auth/login', credentials));
  }

  /** Changes the signed-in user's password; this session goes on with the new token, every other one ends. */
  changePassword(request: ChangePasswordRequest): Observable<UserDto> {
    return this.keep(this.http.post<LoginResponse>('/api/auth/password', request));
  }

  /** Keeps the token and user of a sign-in answer. */
  private keep(answer: Observable<LoginResponse>): Observable<UserDto> {
    return answer.pipe(
      tap(({ token, user }) => {
        localStorage.setItem(TOKEN_KEY, token);
        this.currentToken.set(token);
        this.currentUser.set(user);
      }),
      map(({ user }) => user),
    );
  }

  /**
   * Looks up the user of a token kept from an earlier visit. Emits the user, or null when there
   * is no token or the server refuses it (the token is then forgotten).
   */
  restore(): Observable<UserDto | null> {
    if (this.currentToken() === null) {
      return of(null);
    }
    const context = new HttpContext().set(ENDS_SESSION_ON_401, false);
    return this.http.get<UserDto>('/api/auth/me', { context }).pipe(
      tap((user) => this.currentUser.set(user)),
      catchError((error: unknown) => {
        if (error instanceof HttpErrorResponse && error.status === 401) {
          this.end();
        }
        return of(null);
      }),
    );
  }

  /** Whether the signed-in user holds at least one of `allowed`. */
  hasAnyRole(allowed: readonly Role[]): boolean {
    return this.roles().some((role) => allowed.includes(role));
  }

  /** Forgets the token and the user: the next page needs a fresh sign-in. */
  end(): void {
    localStorage.removeItem(TOKEN_KEY);
    this.currentToken.set(null);
    this.currentUser.set(null);
  }
}
