import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type { ColumnMapping } from '@shared/analysis';
import type { CreatedUploadTokenDto, CreateUploadTokenRequest, SaveColumnMappingRequest, SaveSetupRequest, SetupDto, UploadTokenDto } from '@shared/api';

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

  /** Saves the column mapping the setup's uploads start from, or forgets it with null (experimentalists, admins). */
  saveColumnMapping(id: number, mapping: ColumnMapping | null): Observable<SetupDto> {
    return this.http.put<SetupDto>(`/api/setups/${id}/column-mapping`, { mapping } satisfies SaveColumnMappingRequest);
  }

  /** The setup's upload tokens, newest first, never the tokens themselves (admin or the setup's shift lead). */
  uploadTokens(setupId: number): Observable<UploadTokenDto[]> {
    return this.http.get<UploadTokenDto[]>(`/api/setups/${setupId}/upload-tokens`);
  }

  /** Makes an upload token for the setup's acquisition computer; the answer holds the token, this once. */
  createUploadToken(setupId: number, request: CreateUploadTokenRequest): Observable<CreatedUploadTokenDto> {
    return this.http.post<CreatedUploadTokenDto>(`/api/setups/${setupId}/upload-tokens`, request);
  }

  /** Revokes an upload token: it stops working at once. */
  revokeUploadToken(setupId: number, tokenId: number): Observable<UploadTokenDto> {
    return this.http.post<UploadTokenDto>(`/api/setups/${setupId}/upload-tokens/${tokenId}/revoke`, null);
  }
}
