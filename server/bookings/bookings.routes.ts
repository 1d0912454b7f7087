import { Router } from 'express';
import { bookingListQuerySchema, bookNightRequestSchema } from '@shared/api';
import type { Guards } from '../auth/passport';
import { idParameter } from '../http/id-parameter';
import { validateBody, validQuery } from '../http/validate-body';
import type { AppMail } from '../mail/app-mail';
import type { SetupsService } from '../setups/setups.service';
import type { BookingsService } from './bookings.service';

/** `/api/bookings`: experimentalists, shift leads and admins book nights; everyone signed in reads them. */
export function bookingsRoutes(deps: { bookings: BookingsService; setups: SetupsService; appMail: AppMail; guards: Guards }): Router {
  const { bookings, setups, appMail, guards } = deps;
  const router = Router();

  router.post('/', guards.requireRole('experimentalist', 'shift-lead', 'admin'), validateBody(bookNightRequestSchema), async (request, response) => {
    const booking = await bookings.book(request.body, request.user!);
    appMail.booked(
      booking,
      (await setups.get(booking.setupId)).shiftLeads.map((lead) => lead.email),
    );
    response.status(201).json(booking);
  });

  router.get('/', guards.requireSignIn, async (request, response) => {
    response.json(await bookings.list(validQuery(bookingListQuerySchema, request)));
  });

  router.get('/:id', guards.requireSignIn, async (request, response) => {
    response.json(await bookings.get(idParameter(request, 'booking')));
  });

  return router;
}
