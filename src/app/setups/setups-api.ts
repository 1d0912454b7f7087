import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type { SaveSetupRequest, SetupDto } from '../../../shared/api';

/** The client of the API's setups area. */
@Injectable({ providedIn: 'root' })
export class SetupsApi {
  private readonly http = inject(HttpClient);

  /** Every setup. */
  list(): Observable<SetupDto[]> {
    return this.http.get<SetupDto[]>('/api/setups');
  }

  /** One setup. */
  get(id: number): Observable<SetupDto> {
    return this.http.get<SetupDto>(`/api/setups/${id}`);
  }

  /** Adds a setup (admin). */
  create(request: SaveSetupRequest): Observable<SetupDto> {
    return this.http.post<SetupDto>('/api/setups', request);
  }

  /** Replaces a setup's details and shift leads (admin). */
  update(id: number, request: SaveSetupRequest): Observable<SetupDto> {
    return this.http.put<SetupDto>(`/api/setups/${id}`, request);
  }
}
