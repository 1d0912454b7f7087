import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';

import type { LedgerDto, WorklistDto } from '@shared/api';

/** The ledger of nights and the signed-in person's worklists. */
@Injectable({ providedIn: 'root' })
export class LedgerApi {
  private readonly http = inject(HttpClient);

  /** Every setup's nights from `from` to `to` (inclusive, YYYY-MM-DD). */
  ledger(from: string, to: string): Observable<LedgerDto> {
    return this.http.get<LedgerDto>('/api/ledger', { params: { from, to } });
  }

  worklist(): Observable<WorklistDto> {
    return this.http.get<WorklistDto>('/api/worklist');
  }
}
