import type { FieldDifference } from '@shared/api';

/**
 * The leaves where two results disagree, as paths (`chsh.winFraction`, `checks[2].passed`), in
 * the order a depth-first walk meets them. Numbers must be equal to the last bit (`Object.is`):
 * a re-verification reproduces a result bit for bit or it differs. The fingerprint is left out;
 * it differs exactly when something else does.
 */
export function resultDifferences(stored: unknown, recomputed: unknown): FieldDifference[] {
  const differences: FieldDifference[] = [];
  walk(stored, recomputed, '', differences);
  return differences.filter((difference) => difference.path !== 'fingerprint');
}

function walk(stored: unknown, recomputed: unknown, path: string, differences: FieldDifference[]): void {
  if (Array.isArray(stored) && Array.isArray(recomputed)) {
    for (let index = 0; index < Math.max(stored.length, recomputed.length); index++) {
      walk(stored[index], recomputed[index], `${path}[${index}]`, differences);
    }
    return;
  }
  if (isRecord(stored) && isRecord(recomputed)) {
    const keys = [...new Set([...Object.keys(stored), ...Object.keys(recomputed)])].sort();
    for (const key of keys) walk(stored[key], recomputed[key], path ? `${path}.${key}` : key, differences);
    return;
  }
  if (!Object.is(stored, recomputed)) differences.push({ path, stored: stored ?? null, recomputed: recomputed ?? null });
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return value !== null && typeof value === 'object' && !Array.isArray(value);
}
