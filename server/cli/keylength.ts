import { parseArgs } from 'node:util';
import { generalAttackKeyLength, GeneralAttackRequest, KeyLengthInputError } from '@shared/analysis';
import { formatCount } from '@shared/format/numbers';
import { numberOption, UsageError, type OptionValues } from './command-options';

const USAGE = 'usage: npm run --silent keylength -- --rounds <N> --gamma <γ> --soundness <ε> (--s <S> --qber <Q> | --omega-thr <ω_thr> --syndrome <m>)';
const USAGE_ERROR = 2;

function requiredNumber(values: OptionValues, name: string, what: string): number {
  const value = numberOption(values, name);
  if (value === undefined) throw new UsageError(`give ${what} (--${name})`);
  return value;
}

/** The request the command line describes: the design S and QBER, or a fixed threshold and syndrome length. */
function keyLengthRequest(values: OptionValues): GeneralAttackRequest {
  const common = {
    rounds: requiredNumber(values, 'rounds', 'the number of rounds'),
    testProbability: requiredNumber(values, 'gamma', 'the test probability γ'),
    soundness: requiredNumber(values, 'soundness', 'the total soundness ε'),
  };
  const designed = values.s !== undefined || values.qber !== undefined;
  const fixed = values['omega-thr'] !== undefined || values.syndrome !== undefined;
  if (designed === fixed) throw new UsageError('give either the design (--s and --qber) or the protocol (--omega-thr and --syndrome), one of them');
  if (designed) {
    return { ...common, design: { chshValue: requiredNumber(values, 's', 'the design CHSH value S'), qber: requiredNumber(values, 'qber', 'the design QBER') } };
  }
  return { ...common, omegaThreshold: requiredNumber(values, 'omega-thr', 'the threshold ω_thr'), syndromeBits: requiredNumber(values, 'syndrome', 'the syndrome length in bits') };
}

/**
 * `keylength`: the key length against general attacks (entropy accumulation) as JSON on stdout,
 * with the syndrome length, the threshold and the optimised parameters, and one summary line on
 * stderr. No key is not an error: bits 0 and the reason, exit 0.
 */
function main(): void {
  let values: OptionValues;
  try {
    ({ values } = parseArgs({
      options: {
        rounds: { type: 'string' },
        gamma: { type: 'string' },
        soundness: { type: 'string' },
        s: { type: 'string' },
        qber: { type: 'string' },
        'omega-thr': { type: 'string' },
        syndrome: { type: 'string' },
      },
      strict: true,
      allowPositionals: false,
    }));
  } catch (error) {
    throw new UsageError((error as Error).message);
  }
  const result = generalAttackKeyLength(keyLengthRequest(values));
  process.stdout.write(`${JSON.stringify(result, null, 2)}\n`);
  process.stderr.write(
    result.reason ??
      `${formatCount(result.bits)} key bits against general attacks (entropy accumulation), with a syndrome of ${formatCount(result.syndromeBits)} bits and the threshold ω_thr = ${result.omegaThreshold.toFixed(6)}.`,
  );
  process.stderr.write('\n');
}

try {
  main();
} catch (error) {
  if (error instanceof UsageError) process.stderr.write(`keylength: ${error.message}\n${USAGE}\n`);
  else if (error instanceof KeyLengthInputError) process.stderr.write(`keylength: ${error.message}\n`);
  else process.stderr.write(`keylength: ${error instanceof Error ? error.message : String(error)}\n`);
  process.exitCode = USAGE_ERROR;
}
