import { generalAttackKeyLength, GeneralAttackRequest } from '@shared/analysis/entropy-accumulation';

// `npx tsx bench/keylength.ts`: the time of one key length against general attacks (entropy
// accumulation, every free parameter optimised) for a spread of runs; the target is under 2 s each.

const CASES: [string, GeneralAttackRequest][] = [
  ['published design, n = 1.5e6', { rounds: 1.5e6, testProbability: 13 / 256, soundness: 1e-10, design: { chshValue: 2.64, qber: 0.018 } }],
  ['too few rounds, n = 2e4', { rounds: 2e4, testProbability: 13 / 256, soundness: 1e-10, design: { chshValue: 2.64, qber: 0.018 } }],
  ['long run, n = 1e9', { rounds: 1e9, testProbability: 0.005, soundness: 1e-12, design: { chshValue: 2.7, qber: 0.02 } }],
  ['heavy testing, n = 1e7, γ = 0.1', { rounds: 1e7, testProbability: 0.1, soundness: 1e-6, design: { chshValue: 2.75, qber: 0.01 } }],
  ['fixed threshold, n = 5e6', { rounds: 5e6, testProbability: 0.02, soundness: 1e-9, omegaThreshold: 0.835, syndromeBits: 700_000 }],
];
const REPEATS = 5;

for (const [what, request] of CASES) {
  const seconds: number[] = [];
  let bits = 0;
  for (let i = 0; i < REPEATS; i++) {
    const start = performance.now();
    bits = generalAttackKeyLength(request).bits;
    seconds.push((performance.now() - start) / 1000);
  }
  const slowest = Math.max(...seconds);
  const first = seconds[0];
  process.stdout.write(
    `${what.padEnd(34)} ${String(bits).padStart(10)} bits   first ${first.toFixed(3)} s   slowest ${slowest.toFixed(3)} s   fastest ${Math.min(...seconds).toFixed(3)} s\n`,
  );
}
