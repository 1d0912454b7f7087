import crypto from 'node:crypto';
import { UPLOAD_TOKEN_PREFIX, type CreateUploadTokenRequest, type CreatedUploadTokenDto, type UploadTokenDto } from '@shared/api';
import type { AuditTrail } from '../audit/audit-trail';
import type { Models } from '../database/models';
import { HttpError } from '../http/http-error';
import type { SetupsService } from '../setups/setups.service';
import type { UserRecord } from '../users/user.model';
import type { UploadTokenRecord } from './upload-token.model';

const DAY_MS = 86_400_000;

export interface UploadTokensService {
  list(setupId: number, actor: UserRecord): Promise<UploadTokenDto[]>;
  create(setupId: number, request: CreateUploadTokenRequest, actor: UserRecord): Promise<CreatedUploadTokenDto>;
  revoke(setupId: number, tokenId: number, actor: UserRecord): Promise<UploadTokenDto>;
  /** The live token a raw bearer value names (notes its use), or null: unknown, expired or revoked. */
  authenticate(raw: string): Promise<UploadTokenRecord | null>;
}

function hashOf(raw: string): string {
  return crypto.createHash('sha256').update(raw, 'utf8').digest('hex');
}

/**
 * Upload tokens of the acquisition computer: made by an admin or the setup's shift lead, shown
 * once, stored as SHA-256 (a token has 256 random bits, so a fast hash is enough), good for
 * uploading logs of their setup and nothing else, until they expire or are revoked.
 */
export function createUploadTokensService(models: Models, setups: SetupsService, audit: AuditTrail): UploadTokensService {
  const { UploadToken, User } = models;
  const sequelize = UploadToken.sequelize!;

  async function requireKeeper(setupId: number, actor: UserRecord): Promise<void> {
    await setups.get(setupId);
    if (actor.roles.includes('admin') || (actor.roles.includes('shift-lead') && (await setups.isShiftLeadOf(setupId, actor.id)))) return;
    throw HttpError.forbidden('Only an admin or a shift lead of this setup manages its upload tokens.');
  }

  async function toDtos(records: UploadTokenRecord[]): Promise<UploadTokenDto[]> {
    const people = await User.findAll({ where: { id: [...new Set(records.map((record) => record.createdBy))] } });
    return records.map((record) => ({
      id: record.id,
      setupId: record.setupId,
      name: record.name,
      createdBy: people.find((person) => person.id === record.createdBy)?.name ?? '',
      createdAt: record.createdAt.toISOString(),
      expiresAt: record.expiresAt.toISOString(),
      revokedAt: record.revokedAt?.toISOString() ?? null,
      lastUsedAt: record.lastUsedAt?.toISOString() ?? null,
      station: record.station ?? null,
    }));
  }

  return {
    async list(setupId, actor) {
      await requireKeeper(setupId, actor);
      return toDtos(await UploadToken.findAll({ where: { setupId }, order: [['id', 'DESC']] }));
    },

    async create(setupId, request, actor) {
      await requireKeeper(setupId, actor);
      const token = `${UPLOAD_TOKEN_PREFIX}${crypto.randomBytes(32).toString('base64url')}`;
      const record = await sequelize.transaction(async (transaction) => {
        const created = await UploadToken.create(
          {
            setupId,
            name: request.name.trim(),
            tokenHash: hashOf(token),
            createdBy: actor.id,
            expiresAt: new Date(Date.now() + request.validDays * DAY_MS),
            station: request.station ?? null,
          },
          { transaction },
        );
        await audit.record(
          {
            actorId: actor.id,
            action: 'upload-token.created',
            targetType: 'upload-token',
            targetId: created.id,
            details: { setupId, name: created.name, expiresAt: created.expiresAt.toISOString(), station: created.station },
          },
          transaction,
        );
        return created;
      });
      const [dto] = await toDtos([record]);
      return { ...dto, token };
    },

    async revoke(setupId, tokenId, actor) {
      await requireKeeper(setupId, actor);
      const record = await sequelize.transaction(async (transaction) => {
        const found = await UploadToken.findOne({ where: { id: tokenId, setupId }, transaction, lock: transaction.LOCK.UPDATE });
        if (!found) throw HttpError.notFound(`Setup ${setupId} has no upload token ${tokenId}.`);
        if (found.revokedAt) throw HttpError.conflict(`Upload token “${found.name}” was revoked already.`);
        await found.update({ revokedAt: new Date(), revokedBy: actor.id }, { transaction });
        await audit.record(
          { actorId: actor.id, action: 'upload-token.revoked', targetType: 'upload-token', targetId: found.id, details: { setupId, name: found.name } },
          transaction,
        );
        return found;
      });
      return (await toDtos([record]))[0];
    },

    async authenticate(raw) {
      if (!raw.startsWith(UPLOAD_TOKEN_PREFIX)) return null;
      const record = await UploadToken.findOne({ where: { tokenHash: hashOf(raw) } });
      if (!record || record.revokedAt || record.expiresAt.getTime() <= Date.now()) return null;
      await record.update({ lastUsedAt: new Date() });
      return record;
    },
  };
}
