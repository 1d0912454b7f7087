import { sha256Hex } from '../api/sha256-hex';

/** What the browser found when it hashed a revealed seed. */
export interface CommitmentCheck {
  /** Whether SHA-256 of the seed is the commitment published at booking. */
  matches: boolean;
  /** SHA-256 of the seed's 64 hex characters as ASCII, as the browser computed it. */
  computed: string;
}

/**
 * Checks a revealed seed against the commitment published when its night was booked: the
 * commitment is SHA-256 of the seed's hex characters as ASCII (`printf %s <seed> | sha256sum`).
 * Hex case is ignored in the commitment, not in the seed (its characters are what was hashed).
 */
export async function checkSeedCommitment(seed: string, commitment: string): Promise<CommitmentCheck> {
  const computed = await sha256Hex(seed);
  return { matches: computed === commitment.toLowerCase(), computed };
}
