import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type { AuditActor, AuditFilter, AuditPageDto, AuditQuery, SigningKeyDto, TrailCheckDto } from '@shared/api';
import { FileDownloads } from '../api/download';
import { queryParams } from '../api/query-params';

/** The client of the API's audit area and of the public signing keys. */
@Injectable({ providedIn: 'root' })
export class AuditApi {
  private readonly http = inject(HttpClient);
  private readonly downloads = inject(FileDownloads);

  /** One page of the system-wide trail under the filters, newest first (auditor, admin). */
  trail(query: AuditQuery): Observable<AuditPageDto> {
    return this.http.get<AuditPageDto>('/api/audit', { params: queryParams(query) });
  }

  /** The people who appear in the trail (auditor, admin). */
  actors(): Observable<AuditActor[]> {
    return this.http.get<AuditActor[]>('/api/audit/actors');
  }

  /** Checks the whole trail against its hash chain (auditor, admin). */
  trailCheck(): Observable<TrailCheckDto> {
    return this.http.get<TrailCheckDto>('/api/audit/trail-check');
  }

  /** Downloads the whole filtered trail as CSV; emits the file's name. */
  exportTrail(filters: AuditFilter): Observable<string> {
    return this.downloads.save('/api/audit/export.csv', 'audit-trail.csv', queryParams(filters));
  }

  /** Every key the server signs or signed results with, newest first (public). */
  signingKeys(): Observable<SigningKeyDto[]> {
    return this.http.get<SigningKeyDto[]>('/api/signing-keys');
  }
}
