import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable, switchMap, timer } from 'rxjs';

import type { WorkersOverviewDto } from '@shared/api';

/** How often the admins' view of the workers asks again. */
const REFRESH_MILLISECONDS = 15_000;

/** The client of `/api/workers` (admins). */
@Injectable({ providedIn: 'root' })
export class WorkersApi {
  private readonly http = inject(HttpClient);

  overview(): Observable<WorkersOverviewDto> {
    return this.http.get<WorkersOverviewDto>('/api/workers');
  }

  /** The overview now and every 15 s while subscribed. */
  watch(): Observable<WorkersOverviewDto> {
    return timer(0, REFRESH_MILLISECONDS).pipe(switchMap(() => this.overview()));
  }
}
