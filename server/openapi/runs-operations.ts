import { z } from 'zod';
import {
  auditEventSchema,
  reverificationRequestSchema,
  reverificationSchema,
  runListQuerySchema,
  runPageSchema,
  runSchema,
  realignRequestSchema,
  signOffRequestSchema,
  signOffSchema,
  stationLogQuerySchema,
  stationLogSchema,
  verificationSchema,
  withdrawalSchema,
  withdrawRequestSchema,
} from '@shared/api';
import { uploadFieldsSchema } from '../runs/upload-fields';
import type { Operation } from './operation';

const NO_RUN = { 404: 'No such run.' };
const UNFINISHED = { ...NO_RUN, 409: 'The run has no stored result yet.' };

/**
 * How an acquisition computer hands in a night's log: the recipe the reference page shows at the
 * upload routes.
 */
const ACQUISITION_RECIPE = `**Acquisition recipe** (an acquisition computer with an upload token):
1. Before the night, someone who may book (experimentalist, shift lead, admin) books it with \`POST /api/bookings\`: the seed is drawn then and only its commitment is shown.
2. An admin or a shift lead of the setup makes an upload token with \`POST /api/setups/{id}/upload-tokens\` and puts it on the acquisition computer; it is shown once.
3. After the night the computer sends the log with \`Authorization: Bearer bkup_…\` as \`multipart/form-data\` (the file in field \`log\`, then \`setupId\` and, for a replacement, \`replacementReason\`), with an \`Idempotency-Key\` so a retry never makes a second run; or as a resumable tus 1.0 upload at \`/api/uploads\` with the same fields as metadata.
4. The upload joins the booking it names, else the setup's booking of its \`acquiredOn\` night, else the booking whose window is open or closed less than 24 h ago, and is analysed under the booking's seed and profile. The run's state goes \`queued\` → \`analysing\` → \`accepted\`, \`aborted\`, \`invalid\` (or \`failed\`); poll \`GET /api/runs/{id}\`. The verdict mail goes to the setup's shift leads.
5. Two stations, two logs: each station's computer (a token made with \`station\` A or B) sends its own log with the field \`station\`; the first gets 202 and waits, the second makes the run (201). Unbooked station logs need \`acquiredOn\`: the night pairs them.`;

// The form's fields as documented; `seed` is left out, and refused when sent.
const multipartUpload = uploadFieldsSchema.omit({ seed: true }).extend({ log: z.string().meta({ format: 'binary', description: 'The round log (CSV, or gzip of it).' }) });

/** What a station's log gets while the other station's log of its night is still to come. */
const STATION_WAITS =
  "A station's log (field `station`) whose night still waits for the other station's log: the log, kept and waiting. The other station's log then makes the run (201).";

/** The tus servers' refusal of a request without its protocol version. */
const TUS_VERSION = 'No `Tus-Resumable: 1.0.0` header: the request is not of tus 1.0.';

/** Runs: uploads, lists, the run page's reads, sign-off, and the integrity checks and exports. */
export const RUNS_OPERATIONS: Operation[] = [
  {
    method: 'post',
    path: '/api/runs',
    summary: 'Upload a night’s log',
    description: `The log is hashed into the archive as it streams in, and queued for analysis. A \`seed\` field is refused: the server draws it.\n\n${ACQUISITION_RECIPE}`,
    tags: ['Runs'],
    access: 'uploader',
    headers: z.object({
      'Idempotency-Key': z
        .string()
        .min(1)
        .max(200)
        .optional()
        .meta({ description: 'Makes a repeated request one upload: a repeat gets the run it made (200) or the station’s log it made (202).' }),
    }),
    body: multipartUpload,
    bodyType: 'multipart/form-data',
    status: 201,
    response: runSchema,
    alsoAnswers: [
      { status: 200, description: 'A repeat with the Idempotency-Key of a run already made: that run.', response: runSchema },
      {
        status: 202,
        description: `${STATION_WAITS} A repeat with the Idempotency-Key of such a log gets it again, with its run once the other station’s log came.`,
        response: stationLogSchema,
      },
    ],
    errors: {
      403: 'The uploader may not upload here: another setup’s token, or a profile chosen against the booking.',
      409: 'A replay of an earlier run’s bytes, a window not yet open, or the same Idempotency-Key still being received.',
      413: 'The log is over the upload limit.',
      507: 'The server’s disk is full: the log was not kept.',
    },
  },
  { method: 'get', path: '/api/runs', summary: 'A page of runs under filters and a sort', tags: ['Runs'], access: 'signed-in', query: runListQuerySchema, response: runPageSchema },
  { method: 'get', path: '/api/runs/{id}', summary: 'One run in full, with its result', tags: ['Runs'], access: 'signed-in', response: runSchema, errors: NO_RUN },
  {
    method: 'get',
    path: '/api/runs/{id}/blocks',
    summary: 'The stationarity blocks of a run’s result',
    description: 'Empty until the run is analysed.',
    tags: ['Runs'],
    access: 'signed-in',
    response: z.array(z.looseObject({})).meta({ description: '`BlockSummary` of shared/analysis/report/block-summary.ts, one per block.' }),
    errors: NO_RUN,
  },
  {
    method: 'get',
    path: '/api/runs/{id}/trail',
    summary: 'What happened to the run, oldest first',
    tags: ['Runs'],
    access: 'signed-in',
    response: z.array(auditEventSchema),
    errors: NO_RUN,
  },
  {
    method: 'post',
    path: '/api/runs/{id}/sign-off',
    summary: 'Sign a finished run off',
    description: 'Once per run, by a shift lead assigned to its setup.',
    tags: ['Runs'],
    access: ['shift-lead'],
    body: signOffRequestSchema,
    status: 201,
    response: signOffSchema,
    errors: { ...NO_RUN, 409: 'The run has no verdict yet, or is signed off already.' },
  },
  {
    method: 'get',
    path: '/api/runs/station-logs',
    summary: 'Station logs, newest first (200 at most)',
    description: "Each station's own log of a night; `waiting=true`: only those still waiting for the other station's log.",
    tags: ['Runs'],
    access: 'signed-in',
    query: stationLogQuerySchema,
    response: z.array(stationLogSchema),
  },
  {
    method: 'post',
    path: '/api/runs/{id}/realign',
    summary: 'Re-run a pair of station logs at a stated offset',
    description:
      "By a shift lead of the run's setup, with a written reason: station A's round r is paired with station B's round r + offset. A new run of the same two logs under the same seed and profile, the next attempt of its booking; the result, mail and PDF show the offset. Bellkeep never realigns by itself.",
    tags: ['Runs'],
    access: ['shift-lead'],
    body: realignRequestSchema,
    status: 201,
    response: runSchema,
    errors: { ...NO_RUN, 403: 'Not a shift lead of the run’s setup.', 409: 'The run is one joined log.' },
  },
  {
    method: 'post',
    path: '/api/runs/{id}/withdraw',
    summary: 'Withdraw a mistaken upload before its sign-off',
    description:
      'By the person who uploaded it or an admin (a log sent by an upload token: any experimentalist). The run, its log and its trail stay, marked withdrawn; it awaits no sign-off, its verdict mail is not sent if the analysis had not ended, and the verdict recipients get a short mail.',
    tags: ['Runs'],
    access: 'signed-in',
    body: withdrawRequestSchema,
    status: 201,
    response: withdrawalSchema,
    errors: { ...NO_RUN, 403: 'Neither its uploader nor an admin.', 409: 'The run is signed off or withdrawn already.' },
  },
  {
    method: 'get',
    path: '/api/runs/{id}/verification',
    summary: 'Check the stored result, its signature, the archived log and the trail',
    description: 'Re-hashes the archived log: seconds on a big one.',
    tags: ['Integrity'],
    access: 'signed-in',
    response: verificationSchema,
    errors: UNFINISHED,
  },
  {
    method: 'get',
    path: '/api/runs/{id}/reverifications',
    summary: 'The run’s re-verifications, newest first',
    tags: ['Integrity'],
    access: 'signed-in',
    response: z.array(reverificationSchema),
    errors: NO_RUN,
  },
  {
    method: 'post',
    path: '/api/runs/{id}/reverifications',
    summary: 'Analyse the archived log again',
    description: 'As recorded; or, by an admin only, with another `seed`: a fresh draw of test rounds that never replaces the verdict.',
    tags: ['Integrity'],
    access: ['auditor', 'admin'],
    body: reverificationRequestSchema,
    status: 201,
    response: reverificationSchema,
    errors: UNFINISHED,
  },
  {
    method: 'get',
    path: '/api/runs/{id}/export/{format}',
    summary: 'Export a finished run',
    description: '`format` is one of json (`RunReportDto` of shared/api/integrity.ts, what `npm run verify` checks offline), pdf, counts.csv, blocks.csv. Recorded in the trail.',
    tags: ['Integrity'],
    access: 'signed-in',
    media: { type: 'application/octet-stream', description: 'The file, as an attachment named after the run.' },
    errors: UNFINISHED,
  },
  {
    method: 'post',
    path: '/api/uploads',
    summary: 'Start a resumable upload (tus 1.0)',
    description: `The tus 1.0 creation request: \`Upload-Length\` and \`Upload-Metadata\` with the upload's fields (\`filename\`, \`setupId\`, \`bookingId\`, \`acquiredOn\`, \`notes\`, \`mapping\`, \`replacementReason\`), checked before any byte. Then \`PATCH /api/uploads/{id}\` sends the bytes and \`HEAD\` tells the offset to go on from; the last PATCH answers the run (201). An upload is bound to its uploader.\n\n${ACQUISITION_RECIPE}`,
    tags: ['Runs'],
    access: 'uploader',
    status: 201,
    errors: {
      400: 'A field of `Upload-Metadata` is not valid; `field` names it.',
      403: 'The uploader may not upload here: another setup’s token, or a profile chosen against the booking.',
      409: 'A window not yet open, or a booking already kept.',
      412: TUS_VERSION,
      413: 'The log is over the upload limit.',
      507: 'The server’s disk is full.',
    },
  },
  {
    method: 'head',
    path: '/api/uploads/{id}',
    summary: 'How much of a resumable upload the server has (tus 1.0)',
    description: 'The offset is in `Upload-Offset`.',
    tags: ['Runs'],
    access: 'uploader',
    errors: { 404: 'No upload of this uploader has this id.', 412: TUS_VERSION },
  },
  {
    method: 'patch',
    path: '/api/uploads/{id}',
    summary: 'Send the next bytes of a resumable upload (tus 1.0)',
    description: '`Content-Type: application/offset+octet-stream` from `Upload-Offset`.',
    tags: ['Runs'],
    access: 'uploader',
    status: 204,
    alsoAnswers: [
      { status: 201, description: 'The last bytes are in: the run they made.', response: runSchema },
      { status: 202, description: `The last bytes of a station's log are in: ${STATION_WAITS}`, response: stationLogSchema },
    ],
    errors: {
      404: 'No upload of this uploader has this id.',
      409: 'The offset is not where the upload stands.',
      412: TUS_VERSION,
      507: 'The server’s disk is full: what was written is kept.',
    },
  },
  {
    method: 'get',
    path: '/api/uploads/{id}',
    summary: 'What a finished resumable upload made',
    description: 'For a client whose last answer was lost: the run (200), or the station’s log that waits for the other station’s (202; its `runId` once that came).',
    tags: ['Runs'],
    access: 'uploader',
    response: runSchema,
    alsoAnswers: [{ status: 202, description: `A station’s log: ${STATION_WAITS}`, response: stationLogSchema }],
    errors: { 404: 'No finished upload of this uploader has this id.' },
  },
];
