import { Router } from 'express';
import { z } from 'zod';
import { winFractionFromChshValue } from '../../shared/analysis/statistics/chsh-value';
import { planRounds, PlanInputError } from '../../shared/planner/plan-rounds';
import type { Guards } from '../auth/passport';
import type { Models } from '../database/models';
import { HttpError } from '../http/http-error';
import { validationError } from '../http/validate-body';
import type { ProfilesService } from '../profiles/profiles.service';
import type { SetupsService } from '../setups/setups.service';
import { planPrefill } from './plan-prefill';

const number = (what: string) => z.coerce.number({ error: `must be ${what}` }).refine(Number.isFinite, { error: `must be ${what}` });
const id = (what: string) => z.coerce.number({ error: `must be ${what} id` }).int().positive({ error: `must be ${what} id` });

const planQuerySchema = z
  .strictObject({
    winFraction: number('a win fraction').optional(),
    chshValue: number('a CHSH value').optional(),
    qber: number('an error rate'),
    profileVersionId: id('a profile version'),
    rounds: number('a round count').optional(),
    trialRate: number('rounds per second').optional(),
    xZeroProbability: number('a probability').optional(),
    testFraction: number('a fraction').optional(),
  })
  .refine((query) => (query.winFraction === undefined) !== (query.chshValue === undefined), { error: 'give winFraction or chshValue, one of them', path: ['winFraction'] });

/** `/api/planner`: the round-budget plan for everyone signed in, computed by the same shared code as the screen. */
export function plannerRoutes(deps: { models: Models; setups: SetupsService; profiles: ProfilesService; guards: Guards }): Router {
  const { profiles, guards } = deps;
  const router = Router();

  router.get('/', guards.requireSignIn, async (request, response) => {
    const query = planQuerySchema.safeParse(request.query);
    if (!query.success) throw validationError(query.error);
    const { winFraction, chshValue, qber, profileVersionId, rounds, trialRate, xZeroProbability, testFraction } = query.data;
    const version = await profiles.findVersion(profileVersionId).catch((error: unknown) => {
      throw error instanceof HttpError && error.status === 404 ? HttpError.badRequest(error.message, 'profileVersionId') : error;
    });
    try {
      response.json(
        planRounds({
          device: { winFraction: winFraction ?? winFractionFromChshValue(chshValue!), qber, trialRate, xZeroProbability },
          profile: version.parameters,
          rounds,
          testFraction,
        }),
      );
    } catch (error) {
      if (error instanceof PlanInputError) throw HttpError.badRequest(error.message, error.field);
      throw error;
    }
  });

  router.get('/prefill', guards.requireSignIn, async (request, response) => {
    const query = z.strictObject({ setupId: id('a setup') }).safeParse(request.query);
    if (!query.success) throw validationError(query.error);
    response.json(await planPrefill(query.data.setupId, deps));
  });

  return router;
}
