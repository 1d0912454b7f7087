import type { UploadTokenDto } from '@shared/api';

/** Whether an upload token still works, in words with an icon: never the colour alone. */
export interface UploadTokenState {
  readonly word: 'In use' | 'Expired' | 'Revoked';
  /** Material Symbols name. */
  readonly icon: string;
  /** Whether the token still lets logs in (and may be revoked). */
  readonly live: boolean;
}

/** The state of `token` at `now`: revoked wins over expired. */
export function uploadTokenState(token: Pick<UploadTokenDto, 'expiresAt' | 'revokedAt'>, now: Date): UploadTokenState {
  if (token.revokedAt !== null) return { word: 'Revoked', icon: 'key_off', live: false };
  if (new Date(token.expiresAt).getTime() <= now.getTime()) return { word: 'Expired', icon: 'timer_off', live: false };
  return { word: 'In use', icon: 'key', live: true };
}
