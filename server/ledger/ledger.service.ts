import { QueryTypes, type Sequelize } from 'sequelize';
import {
  LEDGER_DEFAULT_NIGHTS,
  LEDGER_MAX_NIGHTS,
  otherStation,
  type LedgerCellDto,
  type LedgerDto,
  type LedgerQuery,
  type Role,
  type RunState,
  type SignOffDecision,
  type StationName,
  type Verdict,
  type WorkItemDto,
  type WorklistDto,
} from '@shared/api';
import { HttpError } from '../http/http-error';
import { AWAITING_SIGN_OFF, AWAITING_SIGN_OFF_REPLACEMENTS } from '../runs/awaiting-sign-off';

export interface LedgerService {
  /** Every setup's nights in the range: bookings, logs, the latest verdict and its sign-off. */
  ledger(query: LedgerQuery, today?: Date): Promise<LedgerDto>;
  /** What waits for this person, by role: sign-offs (shift lead), own uploads (experimentalist), re-verifications asked for (auditor, admin). */
  worklist(person: { id: number; roles: readonly Role[] }): Promise<WorklistDto>;
}

/** Entries a worklist answers; its count says how many there are in all. */
const WORKLIST_ITEMS = 10;
/** How far back an upload that ended without a verdict (INVALID, failed) stays on its uploader's list. */
const ATTENTION_DAYS = 14;

const DAY_MS = 86_400_000;
const isoDay = (time: number) => new Date(time).toISOString().slice(0, 10);

interface NightRunRow {
  setup_id: number;
  night: string;
  id: number;
  state: RunState;
  verdict: Verdict | null;
  decision: SignOffDecision | null;
  withdrawn: boolean;
}

interface WorkRow {
  id: number;
  setup_name: string;
  night: string | null;
  state: RunState;
  verdict: Verdict | null;
  note: string;
  total: string;
}

/** The ledger of nights (setups × nights) and each person's worklists, read straight from the tables. */
export function createLedgerService(sequelize: Sequelize): LedgerService {
  const select = <Row extends object>(sql: string, replacements: Record<string, unknown>) => sequelize.query<Row>(sql, { type: QueryTypes.SELECT, replacements });

  /** The range asked for, or the last LEDGER_DEFAULT_NIGHTS nights up to today; refused when reversed or too long. */
  function nightRange(query: LedgerQuery, today: Date): { from: string; to: string } {
    const to = query.to ?? (query.from ? isoDay(Date.parse(query.from) + (LEDGER_DEFAULT_NIGHTS - 1) * DAY_MS) : isoDay(today.getTime()));
    const from = query.from ?? isoDay(Date.parse(to) - (LEDGER_DEFAULT_NIGHTS - 1) * DAY_MS);
    const nights = (Date.parse(to) - Date.parse(from)) / DAY_MS + 1;
    if (nights < 1) throw HttpError.badRequest(`from (${from}) is after to (${to})`, 'from');
    if (nights > LEDGER_MAX_NIGHTS) throw HttpError.badRequest(`the ledger shows ${LEDGER_MAX_NIGHTS} nights at most; ${from} to ${to} is ${nights}`, 'to');
    return { from, to };
  }

  /** A worklist's first entries and its count, from a query whose rows carry `count(*) OVER ()` as `total`. */
  async function workList(kind: WorklistDto['lists'][number]['kind'], sql: string, replacements: Record<string, unknown>) {
    const rows = await select<WorkRow>(`${sql} LIMIT ${WORKLIST_ITEMS}`, replacements);
    const items: WorkItemDto[] = rows.map((row) => ({ runId: row.id, setupName: row.setup_name, night: row.night, state: row.state, verdict: row.verdict, note: row.note }));
    return { kind, count: Number(rows[0]?.total ?? 0), items };
  }

  return {
    async ledger(query, today = new Date()) {
      const { from, to } = nightRange(query, today);
      const setups = await select<{ id: number; name: string }>('SELECT id, name FROM setups ORDER BY name', {});
      const bookings = await select<{ id: number; setup_id: number; night: string }>(
        "SELECT id, setup_id, to_char(night, 'YYYY-MM-DD') AS night FROM bookings WHERE night BETWEEN :from AND :to",
        { from, to },
      );
      // Every log of a night, latest first; the first of each (setup, night) is the one the cell shows.
      const runs = await select<NightRunRow>(
        `SELECT r.setup_id, to_char(r.acquired_on, 'YYYY-MM-DD') AS night, r.id, r.state, r.verdict, o.decision, w.run_id IS NOT NULL AS withdrawn
           FROM runs r LEFT JOIN run_sign_offs o ON o.run_id = r.id LEFT JOIN run_withdrawals w ON w.run_id = r.id
          WHERE r.acquired_on BETWEEN :from AND :to
          ORDER BY r.setup_id, r.acquired_on, r.id DESC`,
        { from, to },
      );
      // A station's log waiting for the other station's: its night waits for that station.
      const waiting = await select<{ setup_id: number; night: string; station: StationName }>(
        `SELECT l.setup_id, to_char(coalesce(b.night, l.acquired_on), 'YYYY-MM-DD') AS night, l.station
           FROM station_logs l LEFT JOIN bookings b ON b.id = l.booking_id
          WHERE l.run_id IS NULL AND l.superseded_by IS NULL AND coalesce(b.night, l.acquired_on) BETWEEN :from AND :to`,
        { from, to },
      );
      const cells = new Map<string, LedgerCellDto>();
      const cellOf = (setupId: number, night: string) => {
        const key = `${setupId} ${night}`;
        let cell = cells.get(key);
        if (!cell) cells.set(key, (cell = { night, bookingId: null, attempts: 0, run: null, waitingFor: null }));
        return cell;
      };
      for (const booking of bookings) cellOf(booking.setup_id, booking.night).bookingId = booking.id;
      for (const log of waiting) cellOf(log.setup_id, log.night).waitingFor = otherStation(log.station);
      for (const run of runs) {
        const cell = cellOf(run.setup_id, run.night);
        cell.attempts++;
        cell.run ??= { id: run.id, state: run.state, verdict: run.verdict, signedOff: run.decision !== null, decision: run.decision, withdrawn: run.withdrawn };
      }
      return {
        from,
        to,
        setups: setups.map((setup) => ({
          setupId: setup.id,
          name: setup.name,
          cells: [...cells.entries()]
            .filter(([key]) => key.startsWith(`${setup.id} `))
            .map(([, cell]) => cell)
            .sort((a, b) => a.night.localeCompare(b.night)),
        })),
      };
    },

    async worklist(person) {
      const lists: WorklistDto['lists'] = [];
      const base = `SELECT r.id, s.name AS setup_name, to_char(r.acquired_on, 'YYYY-MM-DD') AS night, r.state, r.verdict, count(*) OVER () AS total`;
      if (person.roles.includes('shift-lead')) {
        lists.push(
          await workList(
            'sign-off',
            `${base}, 'awaits your sign-off' AS note
               FROM runs r JOIN setups s ON s.id = r.setup_id
               JOIN setup_shift_leads l ON l.setup_id = r.setup_id AND l.user_id = :me
              WHERE ${AWAITING_SIGN_OFF}
                AND NOT (s.four_eyes AND r.uploaded_by IS NOT DISTINCT FROM :me)
              ORDER BY r.finished_at DESC NULLS LAST, r.id DESC`,
            { me: person.id, ...AWAITING_SIGN_OFF_REPLACEMENTS },
          ),
        );
      }
      if (person.roles.includes('experimentalist')) {
        lists.push(
          await workList(
            'uploads',
            `${base}, CASE WHEN r.state IN ('queued', 'analysing') THEN 'being analysed' WHEN r.state = 'failed' THEN 'the analysis failed' ELSE 'no verdict was possible' END AS note
               FROM runs r JOIN setups s ON s.id = r.setup_id
              WHERE r.uploaded_by = :me
                AND NOT EXISTS (SELECT 1 FROM run_withdrawals w WHERE w.run_id = r.id)
                AND (r.state IN ('queued', 'analysing') OR (r.state IN ('failed', 'invalid') AND r.created_at > now() - make_interval(days => :days)))
              ORDER BY r.created_at DESC, r.id DESC`,
            { me: person.id, days: ATTENTION_DAYS },
          ),
        );
      }
      if (person.roles.includes('auditor') || person.roles.includes('admin')) {
        lists.push(
          await workList(
            'reverifications',
            `${base}, CASE v.state WHEN 'reproduced' THEN 'reproduced' WHEN 'differs' THEN 'DIFFERS from the stored result' WHEN 'failed' THEN 're-verification failed' ELSE 're-verification ' || v.state END AS note
               FROM run_reverifications v JOIN runs r ON r.id = v.run_id JOIN setups s ON s.id = r.setup_id
              WHERE v.requested_by = :me AND (v.state IN ('queued', 'analysing') OR v.created_at > now() - make_interval(days => :days))
              ORDER BY v.created_at DESC, v.id DESC`,
            { me: person.id, days: ATTENTION_DAYS },
          ),
        );
      }
      return { lists };
    },
  };
}
