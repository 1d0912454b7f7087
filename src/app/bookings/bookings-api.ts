import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type { BookingDto, BookNightRequest } from '@shared/api';

/** The client of the API's bookings area. */
@Injectable({ providedIn: 'root' })
export class BookingsApi {
  private readonly http = inject(HttpClient);

  /** A setup's bookings, newest night first. */
  list(setupId: number): Observable<BookingDto[]> {
    return this.http.get<BookingDto[]>('/api/bookings', { params: { setupId } });
  }

  /** Books a night before acquisition: the server draws the seed and publishes its commitment. */
  book(request: BookNightRequest): Observable<BookingDto> {
    return this.http.post<BookingDto>('/api/bookings', request);
  }
}
