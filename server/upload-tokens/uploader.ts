import type { StationName } from '@shared/api';
import type { UserRecord } from '../users/user.model';

/** Who sends a log: a signed-in person, or the acquisition computer with a setup's upload token. */
export type Uploader = { kind: 'person'; user: UserRecord } | { kind: 'token'; token: { id: number; name: string; setupId: number; station: StationName | null } };

/** The uploader's key in `upload_keys`: idempotency keys are per uploader. */
export function uploaderKey(uploader: Uploader): string {
  return uploader.kind === 'person' ? `user:${uploader.user.id}` : `token:${uploader.token.id}`;
}

/** The uploader as the trail records it: a person is the actor, a token is named in the details. */
export function uploaderInTrail(uploader: Uploader): { actorId: number | null; details: Record<string, unknown> } {
  return uploader.kind === 'person'
    ? { actorId: uploader.user.id, details: {} }
    : { actorId: null, details: { uploadToken: uploader.token.name, uploadTokenId: uploader.token.id } };
}
