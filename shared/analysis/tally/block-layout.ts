/**
 * The block of round index i when N rounds are split into B consecutive blocks: ⌊i·B/N⌋, so block
 * sizes differ by at most one.
 */
export function blockOfRound(round: number, totalRounds: number, blocks: number): number {
  return Math.floor((round * blocks) / totalRounds);
}

/** The first round index of block `block`: the smallest i with ⌊i·B/N⌋ ≥ block, i.e. ⌈block·N/B⌉. */
export function firstRoundOfBlock(block: number, totalRounds: number, blocks: number): number {
  return Math.ceil((block * totalRounds) / blocks);
}
