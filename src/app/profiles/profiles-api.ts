import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type { CreateProfileRequest, CreateProfileVersionRequest, ProfileDto } from '@shared/api';

/** The client of the API's acceptance profiles area. */
@Injectable({ providedIn: 'root' })
export class ProfilesApi {
  private readonly http = inject(HttpClient);

  /** Every profile with its versions, newest first. */
  list(): Observable<ProfileDto[]> {
    return this.http.get<ProfileDto[]>('/api/profiles');
  }

  /** Adds a profile with its first version (admin). */
  create(request: CreateProfileRequest): Observable<ProfileDto> {
    return this.http.post<ProfileDto>('/api/profiles', request);
  }

  /** Adds a version to a profile (admin); older versions stay as they were. */
  addVersion(profileId: number, request: CreateProfileVersionRequest): Observable<ProfileDto> {
    return this.http.post<ProfileDto>(`/api/profiles/${profileId}/versions`, request);
  }
}
