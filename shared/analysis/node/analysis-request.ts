import { ColumnMapping, parseColumnMapping } from '../log/column-mapping';
import { AnalysisProfile, parseProfile } from '../profile';
import { SEED_PATTERN } from './aes-keystream';
import { AnalysisRequestError } from './analysis-errors';
import { drawSeed } from './seed';

/** The validated parameters of one analysis. */
export interface AnalysisRequest {
  profile: AnalysisProfile;
  mapping: ColumnMapping;
  /** Lower-case hex, or null when the log's marking selects the test rounds. */
  seed: string | null;
  /** Whether the byte scanner hands the common rows to the row kernel (false only to check one against the other). */
  rowKernel: boolean;
}

/**
 * Validates the profile, the column mapping and the seed (64 hex digits), drawing a seed from the
 * OS CSPRNG when none is given and the selection needs one.
 */
export function resolveRequest(profileInput: unknown, mappingInput: unknown, seed: string | undefined, rowKernel = true): AnalysisRequest {
  const profile = parseProfile(profileInput);
  if (!profile.ok) {
    throw new AnalysisRequestError(profile.message, 'profile');
  }
  const mapping = parseColumnMapping(mappingInput);
  if (!mapping.ok) {
    throw new AnalysisRequestError(mapping.message, 'mapping');
  }
  if (seed !== undefined && !SEED_PATTERN.test(seed)) {
    throw new AnalysisRequestError('the seed must be 64 hexadecimal digits (256 bits)', 'seed');
  }
  const needsSeed = profile.profile.testSelection.mode !== 'from-log';
  return { profile: profile.profile, mapping: mapping.mapping, seed: needsSeed ? (seed ?? drawSeed()).toLowerCase() : null, rowKernel };
}
