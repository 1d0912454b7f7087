import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable, switchMap, takeWhile, timer } from 'rxjs';

import {
  FINISHED_STATES,
  type AuditEventDto,
  type RealignRequest,
  type ExportFormat,
  type ReverificationDto,
  type ReverificationRequest,
  type ReverificationState,
  type RunDto,
  type RunListQuery,
  type RunPageDto,
  type SignOffDto,
  type SignOffRequest,
  type VerificationDto,
  type WithdrawalDto,
  type WithdrawRequest,
} from '@shared/api';
import { FileDownloads } from '../api/download';
import { queryParams } from '../api/query-params';

/** How often a run still being analysed is asked for again. */
const POLL_MILLISECONDS = 1000;

/** States of a re-verification that has not finished yet. */
const RUNNING_REVERIFICATION_STATES: readonly ReverificationState[] = ['queued', 'analysing'];

/** Whether a re-verification is still queued or analysing. */
export function isReverificationRunning(reverification: ReverificationDto): boolean {
  return RUNNING_REVERIFICATION_STATES.includes(reverification.state);
}

/** The filters, sort and page of the run list (`RunListQuery`, the API's contract); a cleared filter is null. */
export type RunQuery = { [Key in keyof RunListQuery]: undefined extends RunListQuery[Key] ? RunListQuery[Key] | null : RunListQuery[Key] };

/** The client of the API's runs area. */
@Injectable({ providedIn: 'root' })
export class RunsApi {
  private readonly http = inject(HttpClient);
  private readonly downloads = inject(FileDownloads);

  /** One page of runs under the query's filters and sort. */
  list(query: RunQuery): Observable<RunPageDto> {
    return this.http.get<RunPageDto>('/api/runs', { params: queryParams(query) });
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

  /** What happened to the run, oldest first. */
  trail(id: number): Observable<AuditEventDto[]> {
    return this.http.get<AuditEventDto[]>(`/api/runs/${id}/trail`);
  }

  /** A shift lead's sign-off of a finished run. */
  signOff(id: number, request: SignOffRequest): Observable<SignOffDto> {
    return this.http.post<SignOffDto>(`/api/runs/${id}/sign-off`, request);
  }

  /** Runs a pair's two station logs again at a stated offset, with the reason (a shift lead of its setup); answers the new run. */
  realign(id: number, request: RealignRequest): Observable<RunDto> {
    return this.http.post<RunDto>(`/api/runs/${id}/realign`, request);
  }

  /** Withdraws a mistaken upload before its sign-off (its uploader or an admin). */
  withdraw(id: number, request: WithdrawRequest): Observable<WithdrawalDto> {
    return this.http.post<WithdrawalDto>(`/api/runs/${id}/withdraw`, request);
  }

  /**
   * Re-hashes the archived log and checks the stored result and its signature against it. Slow on
   * a big log (seconds), so only on request.
   */
  verify(id: number): Observable<VerificationDto> {
    return this.http.get<VerificationDto>(`/api/runs/${id}/verification`);
  }

  /** The run's re-verifications, newest first. */
  reverifications(id: number): Observable<ReverificationDto[]> {
    return this.http.get<ReverificationDto[]>(`/api/runs/${id}/reverifications`);
  }

  /** The re-verifications now and every second while one is queued or analysing (the settled list is the last value). */
  watchReverifications(id: number): Observable<ReverificationDto[]> {
    return timer(0, POLL_MILLISECONDS).pipe(
      switchMap(() => this.reverifications(id)),
      takeWhile((reverifications) => reverifications.some(isReverificationRunning), true),
    );
  }

  /**
   * Asks for a re-analysis of the archived log (auditor, admin); it starts queued. With `seed` (an
   * admin only), a fresh draw of test rounds that never replaces the verdict.
   */
  requestReverification(id: number, seed?: string): Observable<ReverificationDto> {
    const request: ReverificationRequest | null = seed === undefined ? null : { seed };
    return this.http.post<ReverificationDto>(`/api/runs/${id}/reverifications`, request);
  }

  /** Downloads the run in `format` under the server's file name; emits that name. */
  export(id: number, format: ExportFormat): Observable<string> {
    return this.downloads.save(`/api/runs/${id}/export/${format}`, `run-${id}.${format}`);
  }
}
