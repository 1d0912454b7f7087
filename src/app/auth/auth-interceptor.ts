import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';

import { ENDS_SESSION_ON_401, Session } from './session';
import { signInUrl } from './sign-in-url';

/**
 * Sends the bearer token with every API request; when the server refuses the token (401), the
 * session is over: it is cleared and the user is sent to sign in, then back to the same page.
 */
export const authInterceptor: HttpInterceptorFn = (request, next) => {
  const session = inject(Session);
  const router = inject(Router);
  const token = session.token();
  if (token === null || !request.url.startsWith('/api/')) {
    return next(request);
  }
  const authorised = request.clone({ setHeaders: { Authorization: `Bearer ${token}` } });
  return next(authorised).pipe(
    catchError((error: unknown) => {
      if (error instanceof HttpErrorResponse && error.status === 401 && request.context.get(ENDS_SESSION_ON_401)) {
        session.end();
        void router.navigateByUrl(signInUrl(router, router.url));
      }
      return throwError(() => error);
    }),
  );
};
