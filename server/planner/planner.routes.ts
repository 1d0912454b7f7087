import { Router, type Request } from 'express';
import { planPrefillQuerySchema, planQuerySchema } from '@shared/api';
import { winFractionFromChshValue } from '@shared/analysis';
import { planRounds, PlanInputError, type PlanInput } from '@shared/planner/plan-rounds';
import type { Guards } from '../auth/passport';
import type { Models } from '../database/models';
import { HttpError } from '../http/http-error';
import { validQuery } from '../http/validate-body';
import type { ProfilesService } from '../profiles/profiles.service';
import type { SetupsService } from '../setups/setups.service';
import { planGeneralAttackInThread } from './general-plan-thread';
import { planPrefill } from './plan-prefill';

/** General-attack plans computed at once; each holds a core for seconds. */
const GENERAL_PLANS_AT_ONCE = 2;

/** The planner's refusal of an input, as a 400 naming the field. */
function rethrowRefusal(error: unknown): never {
  if (error instanceof PlanInputError) throw HttpError.badRequest(error.message, error.field);
  throw error;
}

function refusalsAsBadRequests<T>(plan: () => T): T {
  try {
    return plan();
  } catch (error) {
    rethrowRefusal(error);
  }
}

/**
 * `/api/planner`: the round-budget plan for everyone signed in, computed by the same shared code
 * as the screen; `/general-attack` the key length against general attacks over N and γ.
 */
export function plannerRoutes(deps: { models: Models; setups: SetupsService; profiles: ProfilesService; guards: Guards }): Router {
  const { profiles, guards } = deps;
  const router = Router();
  let generalPlansRunning = 0;

  /** The planner input of a request's query, with its profile version's parameters. */
  async function planInputOf(request: Request): Promise<PlanInput> {
    const { winFraction, chshValue, qber, profileVersionId, rounds, trialRate, xZeroProbability, testFraction } = validQuery(planQuerySchema, request);
    const version = await profiles.findVersion(profileVersionId).catch((error: unknown) => {
      throw error instanceof HttpError && error.status === 404 ? HttpError.badRequest(error.message, 'profileVersionId') : error;
    });
    return { device: { winFraction: winFraction ?? winFractionFromChshValue(chshValue!), qber, trialRate, xZeroProbability }, profile: version.parameters, rounds, testFraction };
  }

  router.get('/', guards.requireSignIn, async (request, response) => {
    const input = await planInputOf(request);
    response.json(refusalsAsBadRequests(() => planRounds(input)));
  });

  // Seconds of optimisation: in a thread of its own, a few at a time, stopped if the client leaves.
  router.get('/general-attack', guards.requireSignIn, async (request, response) => {
    const input = await planInputOf(request);
    const recommended = refusalsAsBadRequests(() => planRounds(input));
    if (generalPlansRunning >= GENERAL_PLANS_AT_ONCE) {
      response.set('Retry-After', '10');
      throw new HttpError(503, 'busy', `The planner is computing ${generalPlansRunning} general-attack plans already; ask again in a few seconds.`);
    }
    const clientGone = new AbortController();
    response.on('close', () => clientGone.abort());
    generalPlansRunning += 1;
    try {
      response.json(await planGeneralAttackInThread({ input, recommended }, clientGone.signal).catch(rethrowRefusal));
    } finally {
      generalPlansRunning -= 1;
    }
  });

  router.get('/prefill', guards.requireSignIn, async (request, response) => {
    response.json(await planPrefill(validQuery(planPrefillQuerySchema, request).setupId, deps));
  });

  return router;
}
