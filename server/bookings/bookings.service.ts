import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import type { BookNightRequest, BookingAttemptDto, BookingDto } from '@shared/api';
import type { AuditTrail } from '../audit/audit-trail';
import type { Models } from '../database/models';
import { HttpError } from '../http/http-error';
import type { ProfilesService } from '../profiles/profiles.service';
import type { SetupsService } from '../setups/setups.service';
import type { UserRecord } from '../users/user.model';
import type { BookingRecord } from './booking.model';
import { drawSeed, seedCommitment } from './seed-commitment';

const HOUR_MS = 3_600_000;
/** A window may open this long before the booking is made (the booking is made as acquisition starts). */
const LATE_BOOKING_GRACE_MS = HOUR_MS;
/** The longest acquisition window: two nights. */
const LONGEST_WINDOW_MS = 48 * HOUR_MS;
/** How long after its window closes a booking still takes uploads that name no booking. */
const UPLOAD_GRACE_MS = 24 * HOUR_MS;

export interface BookingsService {
  book(request: BookNightRequest, actor: UserRecord): Promise<BookingDto>;
  list(filter: { setupId?: number }): Promise<BookingDto[]>;
  get(id: number, transaction?: Transaction): Promise<BookingDto>;
  /**
   * The booking an upload belongs to: the one it names, else the setup's booking of the night it
   * names, else the setup's booking whose window is open now or closed less than a day ago. A lab
   * that booked cannot step around its booking by naming none.
   */
  bookingForUpload(setupId: number, named: { bookingId?: number; acquiredOn?: string }, transaction: Transaction): Promise<BookingRecord | null>;
}

/** Nights booked before acquisition: the seed drawn and committed to, the profile fixed. */
export function createBookingsService(deps: { models: Models; profiles: ProfilesService; setups: SetupsService; audit: AuditTrail }): BookingsService {
  const { models, profiles, setups, audit } = deps;
  const { Booking, Run, User, ProfileVersion, Profile, Setup } = models;
  const sequelize = Booking.sequelize!;

  async function toDtos(records: BookingRecord[], transaction?: Transaction): Promise<BookingDto[]> {
    if (records.length === 0) return [];
    const ids = records.map((record) => record.id);
    const [runs, people, versions, setupRecords] = await Promise.all([
      Run.findAll({ where: { bookingId: ids }, order: [['attempt', 'ASC']], transaction }),
      User.findAll({ where: { id: [...new Set(records.map((record) => record.bookedBy))] }, transaction }),
      ProfileVersion.findAll({ where: { id: [...new Set(records.map((record) => record.profileVersionId))] }, transaction }),
      Setup.findAll({ where: { id: [...new Set(records.map((record) => record.setupId))] }, transaction }),
    ]);
    const profileList = await Profile.findAll({ where: { id: versions.map((version) => version.profileId) }, transaction });
    return records.map((record) => {
      const attempts: BookingAttemptDto[] = runs
        .filter((run) => run.bookingId === record.id)
        .map((run) => ({
          runId: run.id,
          attempt: run.attempt!,
          state: run.state,
          verdict: run.verdict ?? null,
          replacementReason: run.replacementReason ?? '',
          createdAt: run.createdAt.toISOString(),
        }));
      const version = versions.find((candidate) => candidate.id === record.profileVersionId)!;
      return {
        id: record.id,
        setupId: record.setupId,
        setupName: setupRecords.find((setup) => setup.id === record.setupId)?.name ?? '',
        night: record.night,
        windowStart: record.windowStart.toISOString(),
        windowEnd: record.windowEnd.toISOString(),
        plannedRounds: record.plannedRounds,
        profileVersionId: record.profileVersionId,
        profileName: profileList.find((profile) => profile.id === version.profileId)?.name ?? '',
        profileVersion: version.version,
        profileReason: record.profileReason,
        seedCommitment: record.seedCommitment,
        // Revealed once a log is in: from then on nobody can choose data to suit it.
        seed: attempts.length > 0 ? record.seed : null,
        bookedBy: people.find((person) => person.id === record.bookedBy)?.name ?? '',
        createdAt: record.createdAt.toISOString(),
        attempts,
      };
    });
  }

  async function get(id: number, transaction?: Transaction): Promise<BookingDto> {
    const record = await Booking.findByPk(id, { transaction });
    if (!record) throw HttpError.notFound(`There is no booking with id ${id}.`);
    return (await toDtos([record], transaction))[0];
  }

  /** The profile version of a new booking: the setup's latest, or another chosen with a reason by a shift lead or admin. */
  async function profileVersionFor(request: BookNightRequest, setupProfileId: number, actor: UserRecord): Promise<{ id: number; reason: string }> {
    const setupVersion = await profiles.latestVersionOf(setupProfileId);
    if (request.profileVersionId === undefined || request.profileVersionId === setupVersion.id) return { id: setupVersion.id, reason: '' };
    const mayChoose = actor.roles.includes('admin') || (actor.roles.includes('shift-lead') && (await setups.isShiftLeadOf(request.setupId, actor.id)));
    if (!mayChoose) {
      throw HttpError.forbidden('Only a shift lead of this setup or an admin may book a night under another profile than the setup’s.');
    }
    const reason = request.profileReason?.trim() ?? '';
    if (reason === '') throw HttpError.badRequest('profileReason: is required when the night is booked under another profile than the setup’s', 'profileReason');
    if (!(await ProfileVersion.findByPk(request.profileVersionId))) {
      throw HttpError.badRequest(`There is no profile version with id ${request.profileVersionId}.`, 'profileVersionId');
    }
    return { id: request.profileVersionId, reason };
  }

  return {
    get,

    async book(request, actor) {
      const setup = await setups.get(request.setupId).catch((error: unknown) => {
        throw error instanceof HttpError && error.status === 404 ? HttpError.badRequest(error.message, 'setupId') : error;
      });
      const windowStart = new Date(request.windowStart);
      const windowEnd = new Date(request.windowEnd);
      if (windowStart.getTime() < Date.now() - LATE_BOOKING_GRACE_MS) {
        throw HttpError.badRequest('windowStart: a night is booked before acquisition; this window opened more than an hour ago', 'windowStart');
      }
      if (windowEnd <= windowStart) throw HttpError.badRequest('windowEnd: must be after windowStart', 'windowEnd');
      if (windowEnd.getTime() - windowStart.getTime() > LONGEST_WINDOW_MS) throw HttpError.badRequest('windowEnd: a window lasts at most 48 hours', 'windowEnd');
      const profile = await profileVersionFor(request, setup.defaultProfileId, actor);
      const seed = drawSeed();
      try {
        const id = await sequelize.transaction(async (transaction) => {
          const booking = await Booking.create(
            {
              setupId: setup.id,
              night: request.night,
              windowStart,
              windowEnd,
              plannedRounds: request.plannedRounds,
              profileVersionId: profile.id,
              profileReason: profile.reason,
              seed,
              seedCommitment: seedCommitment(seed),
              bookedBy: actor.id,
            },
            { transaction },
          );
          await audit.record(
            {
              actorId: actor.id,
              action: 'booking.created',
              targetType: 'booking',
              targetId: booking.id,
              details: {
                setupId: setup.id,
                night: request.night,
                windowStart: windowStart.toISOString(),
                windowEnd: windowEnd.toISOString(),
                plannedRounds: request.plannedRounds,
                profileVersionId: profile.id,
                profileReason: profile.reason,
                seedCommitment: booking.seedCommitment,
              },
            },
            transaction,
          );
          return booking.id;
        });
        return await get(id);
      } catch (error) {
        if (error instanceof UniqueConstraintError) {
          const existing = await Booking.findOne({ where: { setupId: setup.id, night: request.night } });
          throw HttpError.conflict(`The night of ${request.night} on ${setup.name} is booked already (booking ${existing?.id}).`, 'night');
        }
        throw error;
      }
    },

    async list(filter) {
      const records = await Booking.findAll({
        where: filter.setupId === undefined ? {} : { setupId: filter.setupId },
        order: [
          ['night', 'DESC'],
          ['id', 'DESC'],
        ],
        limit: 200,
      });
      return toDtos(records);
    },

    async bookingForUpload(setupId, named, transaction) {
      const lock = transaction.LOCK.UPDATE;
      if (named.bookingId !== undefined) {
        const booking = await Booking.findByPk(named.bookingId, { transaction, lock });
        if (!booking) throw HttpError.badRequest(`There is no booking with id ${named.bookingId}.`, 'bookingId');
        if (booking.setupId !== setupId) throw HttpError.badRequest(`Booking ${booking.id} is for another setup.`, 'bookingId');
        return booking;
      }
      if (named.acquiredOn !== undefined) return Booking.findOne({ where: { setupId, night: named.acquiredOn }, transaction, lock });
      const now = new Date();
      return Booking.findOne({
        where: { setupId, windowStart: { [Op.lte]: now }, windowEnd: { [Op.gte]: new Date(now.getTime() - UPLOAD_GRACE_MS) } },
        order: [['windowStart', 'DESC']],
        transaction,
        lock,
      });
    },
  };
}
