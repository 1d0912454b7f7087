import { z } from 'zod';
import { queryId } from './query-fields';

/** The two stations of a setup: A records settings x and outcomes a, B settings y and outcomes b. */
export const STATIONS = ['A', 'B'] as const;
export type StationName = (typeof STATIONS)[number];

/** The other station. */
export function otherStation(station: StationName): StationName {
  return station === 'A' ? 'B' : 'A';
}

/** The record offsets a shift lead may state for a re-run: A's round r paired with B's round r + k. */
export const STATED_OFFSET_LIMIT = 16;

/** Where the stations were when a pair's run was made: the setup's figures, kept with the run. */
export const stationGeometrySchema = /* @__PURE__ */ z
  .object({ stationDistanceM: z.number(), clockOffsetNs: z.number(), clockUncertaintyNs: z.number() })
  .meta({ id: 'StationGeometryDto', description: "The setup's distance and clock offset as recorded when the run was made; the timing check uses these." });
export type StationGeometryDto = z.infer<typeof stationGeometrySchema>;

/** What a run of two station logs adds: station B's file (station A's is the run's `file`), the stated offset and the geometry. */
export const runStationsSchema = /* @__PURE__ */ z
  .object({
    stationB: z.object({ sha256: z.string(), bytes: z.number().int(), originalName: z.string() }),
    offset: z.number().int().nullable().meta({ description: "A shift lead's stated offset k (A's round r with B's round r + k); null: the records as written." }),
    offsetReason: z.string().nullable(),
    realignedFrom: z.number().int().nullable().meta({ description: 'The run this one re-runs at a stated offset.' }),
    geometry: z.union([stationGeometrySchema, z.null()]).meta({ description: 'Null: the setup had no distance or no clock offset, so the timing is not checked.' }),
  })
  .meta({ id: 'RunStationsDto' });
export type RunStationsDto = z.infer<typeof runStationsSchema>;

/** One station's uploaded log: waiting for the other station's, or joined into a run. */
export const stationLogSchema = /* @__PURE__ */ z
  .object({
    id: z.number().int(),
    setupId: z.number().int(),
    station: z.enum(STATIONS),
    bookingId: z.number().int().nullable(),
    acquiredOn: z.string().nullable(),
    sha256: z.string(),
    bytes: z.number().int(),
    originalName: z.string(),
    uploadedBy: z.string(),
    createdAt: z.string(),
    runId: z.number().int().nullable().meta({ description: 'The run of the pair, once the other station’s log came; null: waiting for it.' }),
    supersededBy: z.number().int().nullable().meta({ description: 'A later log of the same station and night that replaced this one before the pair was complete.' }),
  })
  .meta({ id: 'StationLogDto' });
export type StationLogDto = z.infer<typeof stationLogSchema>;

/** Body of `POST /api/runs/:id/realign` (a shift lead of the run's setup): run the same two logs again at a stated offset. */
export const realignRequestSchema = /* @__PURE__ */ z
  .strictObject({
    offset: z
      .number({ error: 'must be a whole number of rounds' })
      .int('must be a whole number of rounds')
      .min(-STATED_OFFSET_LIMIT, `must be at least −${STATED_OFFSET_LIMIT}`)
      .max(STATED_OFFSET_LIMIT, `must be at most ${STATED_OFFSET_LIMIT}`),
    reason: z.string().trim().min(1, 'is required: say why the records are paired at this offset').max(2000),
  })
  .meta({ id: 'RealignRequest' });
export type RealignRequest = z.infer<typeof realignRequestSchema>;

/** The filters of `GET /api/station-logs`. */
export const stationLogQuerySchema = /* @__PURE__ */ z
  .strictObject({
    setupId: queryId('a setup').optional(),
    waiting: z
      .enum(['true'], { error: 'must be true' })
      .transform(() => true)
      .optional()
      .meta({ description: "Only logs still waiting for the other station's log of their night." }),
  })
  .meta({ description: 'The filters of the station log list (the newest 200).' });
export type StationLogQuery = z.infer<typeof stationLogQuerySchema>;
