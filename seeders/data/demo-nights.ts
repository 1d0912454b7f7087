import type { DeviceModel } from '@fixtures/device-model';
import { FIXTURE_SEED, steadyPair } from '@fixtures/fixture-set';

/** Nights of demo history per setup (three weeks), ending the night before the demo was loaded. */
export const DEMO_NIGHTS = 21;

/** Rounds per demo night on each setup: enough for a positive finite key on most nights. */
const ROUNDS_PER_NIGHT: Readonly<Record<string, number>> = { 'Fen link': 200_000, 'Mill Lane bench': 1_500_000 };

/**
 * The invented device model of one demo night: a steady pair whose visibility and key error
 * wander a little from night to night, with a bad night on the Fen link (a fibre connector
 * working loose: low visibility) and one drifting night on the bench.
 */
export function demoNight(setupName: string, night: number): { model: DeviceModel; seed: string } {
  const wobble = Math.sin(night * 1.7 + setupName.length) * 0.006;
  const badNight = setupName === 'Fen link' && night === 9;
  const driftingNight = setupName === 'Mill Lane bench' && night === 5;
  const model: DeviceModel = {
    ...steadyPair,
    rounds: ROUNDS_PER_NIGHT[setupName] ?? 200_000,
    visibility: driftingNight ? (f) => 0.975 - 0.05 * f : () => (badNight ? 0.86 : 0.972 + wobble),
    keyError: () => 0.018 + wobble / 2,
  };
  // One seed per setup and night: the shared demo seed with both numbers in its last bytes.
  const seed = FIXTURE_SEED.slice(0, 60) + (setupName === 'Fen link' ? '1' : '2') + night.toString(16).padStart(3, '0');
  return { model, seed };
}

/** The demo night left unbooked (the lab forgot to book it): Mill Lane bench, night 12. */
export const UNBOOKED_NIGHT = { setupName: 'Mill Lane bench', night: 12 } as const;

/**
 * The demo night whose log was replaced: the Fen link's night 14 was first uploaded before the
 * acquisition computer had finished writing it (its first quarter only), then again in full.
 */
export const REPLACED_NIGHT = {
  setupName: 'Fen link',
  night: 14,
  firstShare: 0.25,
  reason: 'The first upload was copied while the acquisition computer was still writing the file: it holds only the first quarter of the night.',
} as const;
