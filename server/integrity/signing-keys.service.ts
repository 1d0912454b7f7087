import type { Sequelize } from 'sequelize';
import type { SigningKeyDto } from '@shared/api';
import type { AuditTrail } from '../audit/audit-trail';
import type { Models } from '../database/models';
import type { SigningKey } from './signing-key';

export interface SigningKeysService {
  /** The key this process signs with. */
  readonly current: SigningKey;
  /**
   * Lists this process's key as the one in use, retiring the one before it (a rotation), once.
   * A key that was retired cannot come back: signing with it again is refused with the reason.
   */
  register(): Promise<void>;
  /** Every key ever used, newest first. */
  list(): Promise<SigningKeyDto[]>;
  /** A listed key by id, or null. */
  find(keyId: string): Promise<SigningKeyDto | null>;
}

export function createSigningKeysService(sequelize: Sequelize, models: Models, audit: AuditTrail, current: SigningKey): SigningKeysService {
  const toDto = (key: InstanceType<Models['SigningKey']>): SigningKeyDto => ({
    keyId: key.keyId.trim(),
    algorithm: 'Ed25519',
    publicKeyPem: key.publicKeyPem,
    createdAt: key.createdAt.toISOString(),
    retiredAt: key.retiredAt?.toISOString() ?? null,
  });

  return {
    current,

    async register() {
      await sequelize.transaction(async (transaction) => {
        // One registration at a time across processes: the API and its workers start together.
        await sequelize.query("SELECT pg_advisory_xact_lock(hashtext('bellkeep.signing-keys'))", { transaction });
        const known = await models.SigningKey.findByPk(current.keyId, { transaction });
        if (known?.retiredAt) {
          throw new Error(
            `The signing key ${current.keyId} was retired on ${known.retiredAt.toISOString()}; give this process the key in use (BELLKEEP_SIGNING_KEY) or a new one.`,
          );
        }
        if (known) return;
        for (const previous of await models.SigningKey.findAll({ where: { retiredAt: null }, transaction })) {
          await previous.update({ retiredAt: new Date() }, { transaction });
          await audit.record(
            { actorId: null, action: 'signing-key.retired', targetType: 'signing-key', targetId: previous.keyId.trim(), details: { replacedBy: current.keyId } },
            transaction,
          );
        }
        await models.SigningKey.create({ keyId: current.keyId, publicKeyPem: current.publicKeyPem }, { transaction });
        await audit.record({ actorId: null, action: 'signing-key.registered', targetType: 'signing-key', targetId: current.keyId, details: {} }, transaction);
      });
    },

    async list() {
      return (await models.SigningKey.findAll({ order: [['createdAt', 'DESC']] })).map(toDto);
    },

    async find(keyId) {
      const key = await models.SigningKey.findByPk(keyId);
      return key ? toDto(key) : null;
    },
  };
}
