import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';

import type { ResetPasswordRequest } from '@shared/api';

/** Setting a password by a mailed reset link (no sign-in needed). */
@Injectable({ providedIn: 'root' })
export class PasswordsApi {
  private readonly http = inject(HttpClient);

  reset(request: ResetPasswordRequest): Observable<void> {
    return this.http.post<void>('/api/auth/password-reset', request);
  }
}
