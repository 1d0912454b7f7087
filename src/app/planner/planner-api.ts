import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type { PlanPrefillDto } from '@shared/api';

/** The client of the API's planner area; the plan itself is computed in the browser. */
@Injectable({ providedIn: 'root' })
export class PlannerApi {
  private readonly http = inject(HttpClient);

  /** What a setup's latest accepted runs did, pooled, and the setup's profile version. */
  prefill(setupId: number): Observable<PlanPrefillDto> {
    return this.http.get<PlanPrefillDto>('/api/planner/prefill', { params: { setupId } });
  }
}
