import { HttpClient, HttpEvent, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable, switchMap, takeWhile, timer } from 'rxjs';

import {
  FINISHED_STATES,
  type AuditEventDto,
  type RunDto,
  type RunPageDto,
  type RunSortKey,
  type RunState,
  type SignOffDto,
  type Verdict,
} from '../../../shared/api';
import type { ColumnMapping } from '../../../shared/analysis/log/column-mapping';

/** How often a run still being analysed is asked for again. */
const POLL_MILLISECONDS = 1000;

/** The filters, sort and page of the run list, as `GET /api/runs` takes them. */
export interface RunQuery {
  page: number;
  pageSize: number;
  sort: RunSortKey;
  direction: 'asc' | 'desc';
  setupId?: number | null;
  state?: RunState | null;
  verdict?: Verdict | null;
  /** YYYY-MM-DD, inclusive. */
  from?: string | null;
  to?: string | null;
  uploadedBy?: number | null;
}

/** What an experimentalist sends with a log. */
export interface UploadRequest {
  log: File;
  setupId: number;
  profileId: number;
  mapping: ColumnMapping;
  acquiredOn?: string | null;
  notes?: string | null;
}

/** The client of the API's runs area. */
@Injectable({ providedIn: 'root' })
export class RunsApi {
  private readonly http = inject(HttpClient);

  /** One page of runs under the query's filters and sort. */
  list(query: RunQuery): Observable<RunPageDto> {
    let params = new HttpParams();
    for (const [key, value] of Object.entries(query)) {
      if (value !== null && value !== undefined && value !== '') params = params.set(key, String(value));
    }
    return this.http.get<RunPageDto>('/api/runs', { params });
  }

  /** One run in full. */
  get(id: number): Observable<RunDto> {
    return this.http.get<RunDto>(`/api/runs/${id}`);
  }

  /** The run now and every second until its state is finished (the finished run is the last value). */
  watch(id: number): Observable<RunDto> {
    return timer(0, POLL_MILLISECONDS).pipe(
      switchMap(() => this.get(id)),
      takeWhile((run) => !FINISHED_STATES.includes(run.state), true),
    );
  }

  /** Uploads a log with its setup, profile and mapping; the events carry the upload progress. */
  upload(request: UploadRequest): Observable<HttpEvent<RunDto>> {
    const form = new FormData();
    form.append('setupId', String(request.setupId));
    form.append('profileId', String(request.profileId));
    form.append('mapping', JSON.stringify(request.mapping));
    if (request.acquiredOn) form.append('acquiredOn', request.acquiredOn);
    if (request.notes) form.append('notes', request.notes);
    // The file goes last: the server reads the fields before the log's bytes.
    form.append('log', request.log, request.log.name);
    return this.http.post<RunDto>('/api/runs', form, { reportProgress: true, observe: 'events' });
  }

  /** What happened to the run, oldest first. */
  trail(id: number): Observable<AuditEventDto[]> {
    return this.http.get<AuditEventDto[]>(`/api/runs/${id}/trail`);
  }

  /** A shift lead's sign-off of a finished run. */
  signOff(id: number, comment: string): Observable<SignOffDto> {
    return this.http.post<SignOffDto>(`/api/runs/${id}/sign-off`, { comment });
  }
}
