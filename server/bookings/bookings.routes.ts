import { Router } from 'express';
import { z } from 'zod';
import type { Guards } from '../auth/passport';
import { idParameter } from '../http/id-parameter';
import { validateBody, validationError } from '../http/validate-body';
import type { AppMail } from '../mail/app-mail';
import type { SetupsService } from '../setups/setups.service';
import type { BookingsService } from './bookings.service';

const positiveId = z.number({ error: 'must be an id' }).int().positive({ error: 'must be an id' });

const bookSchema = z.strictObject({
  setupId: positiveId,
  night: z.iso.date({ error: 'must be a date as YYYY-MM-DD' }),
  windowStart: z.iso.datetime({ offset: true, error: 'must be an ISO date-time' }),
  windowEnd: z.iso.datetime({ offset: true, error: 'must be an ISO date-time' }),
  plannedRounds: z.number({ error: 'must be a number of rounds' }).int().positive().max(Number.MAX_SAFE_INTEGER),
  profileVersionId: positiveId.optional(),
  profileReason: z.string().max(2000).optional(),
});

const listSchema = z.strictObject({ setupId: z.coerce.number({ error: 'must be a setup id' }).int().positive({ error: 'must be a setup id' }).optional() });

/** `/api/bookings`: experimentalists, shift leads and admins book nights; everyone signed in reads them. */
export function bookingsRoutes(deps: { bookings: BookingsService; setups: SetupsService; appMail: AppMail; guards: Guards }): Router {
  const { bookings, setups, appMail, guards } = deps;
  const router = Router();

  router.post('/', guards.requireRole('experimentalist', 'shift-lead', 'admin'), validateBody(bookSchema), async (request, response) => {
    const booking = await bookings.book(request.body as z.infer<typeof bookSchema>, request.user!);
    appMail.booked(booking, (await setups.get(booking.setupId)).shiftLeads.map((lead) => lead.email));
    response.status(201).json(booking);
  });

  router.get('/', guards.requireSignIn, async (request, response) => {
    const query = listSchema.safeParse(request.query);
    if (!query.success) throw validationError(query.error);
    response.json(await bookings.list(query.data));
  });

  router.get('/:id', guards.requireSignIn, async (request, response) => {
    response.json(await bookings.get(idParameter(request, 'booking')));
  });

  return router;
}
