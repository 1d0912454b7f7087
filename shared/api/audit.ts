import { z } from 'zod';
import { isoDate, paging } from './query-fields';
import { auditEventSchema } from './runs';

export const AUDIT_TARGET_TYPES = ['run', 'user', 'profile', 'setup', 'booking', 'upload-token', 'signing-key', 'audit'] as const;
export type AuditTargetType = (typeof AUDIT_TARGET_TYPES)[number];

/** What the system-wide trail can be narrowed to (`GET /api/audit/export.csv`; `GET /api/audit` pages it). */
export const auditFilterSchema = /* @__PURE__ */ z
  .strictObject({
    actorId: z.coerce.number({ error: 'must be a user id' }).int().positive({ error: 'must be a user id' }).optional(),
    action: z
      .string()
      .regex(/^[a-z-]+(\.[a-z-]*)?$/, 'must be an action such as run.exported, or a family such as run.')
      .optional()
      .meta({ description: 'Exact action, e.g. `run.exported`, or a family ending in a dot, e.g. `profile.`.' }),
    targetType: z.enum(AUDIT_TARGET_TYPES, { error: `must be one of ${AUDIT_TARGET_TYPES.join(', ')}` }).optional(),
    targetId: z.string().max(64, 'must be at most 64 characters').optional(),
    from: isoDate.optional().meta({ description: 'Inclusive dates, YYYY-MM-DD (UTC).' }),
    to: isoDate.optional(),
  })
  .meta({ description: 'The trail narrowed to an actor, an action, a target and dates.' });
export type AuditFilter = z.infer<typeof auditFilterSchema>;

/** The filters of the trail with its page (`GET /api/audit`). */
export const auditQuerySchema = /* @__PURE__ */ auditFilterSchema.extend(paging(50, 500)).meta({ description: 'The filtered trail, a page at a time.' });
export type AuditQuery = z.infer<typeof auditQuerySchema>;

/** Someone who appears in the trail, as `GET /api/audit/actors` lists them for the actor filter. */
export const auditActorSchema = /* @__PURE__ */ z.object({ id: z.number().int(), name: z.string() }).meta({ id: 'AuditActor' });
export type AuditActor = z.infer<typeof auditActorSchema>;

/** A page of the trail, newest first. */
export const auditPageSchema = /* @__PURE__ */ z
  .object({ items: z.array(auditEventSchema), total: z.number().int(), page: z.number().int(), pageSize: z.number().int() })
  .meta({ id: 'AuditPageDto' });
export type AuditPageDto = z.infer<typeof auditPageSchema>;

/**
 * Every action the trail records, as `noun.verb`. Details carry what the line needs: a run's
 * `verdict`, a sign-off's `comment`, an export's `format`, a re-verification's `state`...
 */
export const AUDIT_ACTIONS = [
  'user.created',
  'user.changed',
  'user.password-changed',
  'user.password-reset-link-sent',
  'user.password-reset',
  'setup.created',
  'setup.changed',
  'profile.created',
  'profile.version-created',
  'booking.created',
  'upload-token.created',
  'upload-token.revoked',
  'station-log.uploaded',
  'run.uploaded',
  'run.realigned',
  'run.analysis-started',
  'run.finished',
  'run.failed',
  'run.mail-sent',
  'run.mail-skipped',
  'run.signed-off',
  'run.withdrawn',
  'run.exported',
  'run.reverification-requested',
  'run.reverification-finished',
  'signing-key.registered',
  'signing-key.retired',
  'audit.exported',
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

/** Problems `GET /api/audit/trail-check` lists at most; `problemCount` tells how many it found. */
export const TRAIL_CHECK_PROBLEM_LIMIT = 20;

/** The newest link of the trail's hash chain: its place and its SHA-256, hex. */
export const trailChainHeadSchema = /* @__PURE__ */ z.object({ seq: z.number().int(), hash: z.string() }).meta({ id: 'TrailChainHeadDto' });
export type TrailChainHeadDto = z.infer<typeof trailChainHeadSchema>;

/**
 * The check of the whole system trail against its hash chain (`GET /api/audit/trail-check`): every
 * event has its link, every link its event, each link's hash recomputes from its event and the link
 * before, seq runs 1, 2, 3 ... without a gap, and the head names the last link.
 */
export const trailCheckSchema = /* @__PURE__ */ z
  .object({
    intact: z.boolean().meta({ description: 'True only when no problem was found.' }),
    events: z.number().int().meta({ description: 'Events in the trail now.' }),
    head: trailChainHeadSchema.nullable().meta({ description: "As the chain's head records it; null before the first event (or when the head is gone)." }),
    checkedAt: z.string(),
    problems: z.array(z.string()).meta({ description: 'The first problems in chain order, each a sentence naming its link (seq) or event (id).' }),
    problemCount: z.number().int().meta({ description: 'Every problem found, listed or not.' }),
  })
  .meta({ id: 'TrailCheckDto' });
export type TrailCheckDto = z.infer<typeof trailCheckSchema>;
