import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type { CreateUserRequest, PasswordResetLinkDto, UpdateUserRequest, UserDto } from '@shared/api';

/** The client of the API's user management (admin only). */
@Injectable({ providedIn: 'root' })
export class UsersApi {
  private readonly http = inject(HttpClient);

  /** Every user, active or not. */
  list(): Observable<UserDto[]> {
    return this.http.get<UserDto[]>('/api/users');
  }

  /** Adds a user; fails with 409 when the e-mail is taken. */
  create(request: CreateUserRequest): Observable<UserDto> {
    return this.http.post<UserDto>('/api/users', request);
  }

  /** Changes a user's name, roles or active state. */
  update(id: number, changes: UpdateUserRequest): Observable<UserDto> {
    return this.http.patch<UserDto>(`/api/users/${id}`, changes);
  }

  /** Mails the user a single-use link to set their password. */
  mailResetLink(id: number): Observable<PasswordResetLinkDto> {
    return this.http.post<PasswordResetLinkDto>(`/api/users/${id}/password-reset-link`, {});
  }
}
