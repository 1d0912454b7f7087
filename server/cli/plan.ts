import { readFile } from 'node:fs/promises';
import { parseArgs } from 'node:util';
import { winFractionFromChshValue } from '@shared/analysis';
import { formatCount, formatPercent } from '@shared/format/numbers';
import { generalPlanProblem, planGeneralAttack } from '@shared/planner/plan-general-attack';
import { planRounds, PlanInputError } from '@shared/planner/plan-rounds';
import { numberOption, UsageError } from './command-options';

const USAGE =
  'usage: npm run --silent plan -- (--win <ω> | --s <S>) --qber <rate> [--profile <profile.json>] [--rounds <N>] [--rate <rounds/s>] [--x0 <P(x=0)>] [--test-fraction <share>] [--general]';
const USAGE_ERROR = 2;

/**
 * `plan`: the round-budget plan for tonight, as JSON on stdout (the `PlanDto` of `GET
 * /api/planner`) and a short summary on stderr. Without --rounds it plans at the smallest budget
 * that gives both a positive key and a 99 % chance of passing. --general adds the key length
 * against general attacks (`generalAttack`, the `GeneralAttackPlanDto` of
 * `GET /api/planner/general-attack`): a few seconds more.
 */
async function main(): Promise<void> {
  let values;
  try {
    ({ values } = parseArgs({
      options: {
        win: { type: 'string' },
        s: { type: 'string' },
        qber: { type: 'string' },
        profile: { type: 'string' },
        rounds: { type: 'string' },
        rate: { type: 'string' },
        x0: { type: 'string' },
        'test-fraction': { type: 'string' },
        general: { type: 'boolean' },
      },
      strict: true,
      allowPositionals: false,
    }));
  } catch (error) {
    throw new UsageError((error as Error).message);
  }
  const win = numberOption(values, 'win');
  const chshValue = numberOption(values, 's');
  const qber = numberOption(values, 'qber');
  if ((win === undefined) === (chshValue === undefined)) throw new UsageError('give the expected win fraction (--win) or S (--s), one of them');
  if (qber === undefined) throw new UsageError('give the expected QBER (--qber)');
  let profile: unknown = {};
  if (values.profile !== undefined) {
    try {
      profile = JSON.parse(await readFile(values.profile, 'utf8'));
    } catch (error) {
      throw new UsageError(`cannot read the profile ${values.profile}: ${(error as Error).message}`);
    }
  }
  const input = {
    device: { winFraction: win ?? winFractionFromChshValue(chshValue!), qber, trialRate: numberOption(values, 'rate'), xZeroProbability: numberOption(values, 'x0') },
    profile,
    rounds: numberOption(values, 'rounds'),
    testFraction: numberOption(values, 'test-fraction'),
  };
  const plan = planRounds(input);
  const general = values.general ? planGeneralAttack(generalPlanProblem(input, plan)) : undefined;
  process.stdout.write(`${JSON.stringify(general ? { ...plan, generalAttack: general } : plan, null, 2)}\n`);
  const { at } = plan;
  const budget = (rounds: number | null) => (rounds === null ? 'none up to the search limit' : `${formatCount(rounds)} rounds`);
  process.stderr.write(
    [
      `At ${formatCount(at.rounds)} rounds: pass ${formatPercent(at.passProbability.all, 1)} (CHSH ${formatPercent(at.passProbability.chsh, 1)}, QBER ${formatPercent(at.passProbability.qber, 1)}), expected finite key ${formatCount(at.expectedFiniteKeyBits)} bits (collective attacks, an estimate).`,
      `Positive key from ${budget(plan.roundsForPositiveKey)}; 99 % pass from ${budget(plan.roundsForLikelyPass)}.`,
      ...(at.acquisitionSeconds === null ? [] : [`Acquisition at ${formatCount(plan.device.trialRate!)} rounds/s: ${formatCount(at.acquisitionSeconds)} s.`]),
      ...(general
        ? [
            `Against general attacks (entropy accumulation, an estimate): ${formatCount(general.at.bits)} bits at γ = ${general.at.testProbability}; a key from ${budget(general.roundsForPositiveKey)}; best γ ${general.bestTestProbability ? `${general.bestTestProbability.testProbability.toFixed(4)} (${formatCount(general.bestTestProbability.bits)} bits)` : 'none gives a key'}.`,
          ]
        : []),
      '',
    ].join('\n'),
  );
}

main().catch((error: unknown) => {
  if (error instanceof UsageError) process.stderr.write(`plan: ${error.message}\n${USAGE}\n`);
  else if (error instanceof PlanInputError) process.stderr.write(`plan: ${error.message}\n`);
  else process.stderr.write(`plan: ${error instanceof Error ? error.message : String(error)}\n`);
  process.exitCode = USAGE_ERROR;
});
