import { QueryTypes, type Sequelize } from 'sequelize';
import { TRAIL_CHECK_PROBLEM_LIMIT, type TrailCheckDto } from '@shared/api';

/** One problem as the query finds it; `otherSeq` is the link before a gap, or the last link for the head's problems. */
interface FoundProblem {
  kind: 'gap' | 'event-gone' | 'hash-differs' | 'unlinked' | 'head-ahead' | 'head-behind' | 'head-differs' | 'head-missing';
  seq: number | null;
  event_id: number | null;
  other_seq: number | null;
}

interface CheckRow {
  events: string;
  head_seq: string | null;
  head_hash: string | null;
  problem_count: string;
  listed: FoundProblem[];
}

/**
 * The whole chain in one statement, so one snapshot: each link beside the one before it (window
 * functions over seq, read in the primary key's order) and its event. A link's hash is recomputed
 * only when the link before it is there; a gap is its own problem.
 */
const CHECK_QUERY = `
  WITH chain AS (
    SELECT link.seq, link.event_id, link.hash,
           lag(link.seq) OVER by_seq AS previous_seq,
           lag(link.hash) OVER by_seq AS previous_hash,
           event
    FROM audit_chain_links link
    LEFT JOIN audit_events event ON event.id = link.event_id
    WINDOW by_seq AS (ORDER BY link.seq)
  ),
  ends AS (
    SELECT head.seq AS head_seq, head.hash AS head_hash, coalesce(last.seq, 0) AS last_seq, last.hash AS last_hash
    FROM (SELECT) AS one_row
    LEFT JOIN audit_chain_head head ON true
    LEFT JOIN (SELECT seq, hash FROM audit_chain_links ORDER BY seq DESC LIMIT 1) last ON true
  ),
  problems AS (
    SELECT 'gap' AS kind, seq, event_id, coalesce(previous_seq, 0) AS other_seq
      FROM chain WHERE seq <> coalesce(previous_seq, 0) + 1
    UNION ALL
    SELECT 'event-gone', seq, event_id, NULL FROM chain WHERE (event).id IS NULL
    UNION ALL
    SELECT 'hash-differs', seq, event_id, NULL
      FROM chain
      WHERE (event).id IS NOT NULL AND seq = coalesce(previous_seq, 0) + 1
        AND hash <> audit_chain_hash(previous_hash, seq, event)
    UNION ALL
    SELECT 'unlinked', NULL, event.id, NULL
      FROM audit_events event
      WHERE NOT EXISTS (SELECT FROM audit_chain_links link WHERE link.event_id = event.id)
    UNION ALL
    SELECT CASE WHEN head_seq IS NULL THEN 'head-missing'
                WHEN head_seq > last_seq THEN 'head-ahead'
                WHEN head_seq < last_seq THEN 'head-behind'
                ELSE 'head-differs' END,
           head_seq, NULL, last_seq
      FROM ends
      WHERE head_seq IS DISTINCT FROM last_seq OR head_hash IS DISTINCT FROM last_hash
  )
  SELECT (SELECT count(*) FROM audit_events) AS events,
         (SELECT head_seq FROM ends) AS head_seq,
         (SELECT head_hash FROM ends) AS head_hash,
         (SELECT count(*) FROM problems) AS problem_count,
         (SELECT coalesce(json_agg(listed), '[]') FROM (SELECT * FROM problems ORDER BY seq NULLS LAST, event_id LIMIT :limit) listed) AS listed`;

/** A problem in a sentence that names its link or event and says what was done to the trail. */
function problemSentence(problem: FoundProblem): string {
  const { seq, event_id: eventId, other_seq: otherSeq } = problem;
  switch (problem.kind) {
    case 'gap': {
      const missing = seq! - otherSeq! - 1;
      const which = missing === 1 ? `Link ${otherSeq! + 1} is` : `Links ${otherSeq! + 1} to ${seq! - 1} are`;
      return `${which} missing before link ${seq} (event ${eventId}): ${missing === 1 ? 'a link and its event were' : 'links and their events were'} removed.`;
    }
    case 'event-gone':
      return `Link ${seq} records event ${eventId}, which is no longer in the trail: the event’s row was removed.`;
    case 'hash-differs':
      return `Event ${eventId} no longer hashes to link ${seq}: a field of the event was changed after it was recorded.`;
    case 'unlinked':
      return `Event ${eventId} has no link in the chain: it was written while the chain’s trigger was switched off.`;
    case 'head-ahead': {
      const removed = seq! - otherSeq!;
      return `The chain’s head is at link ${seq}, but the last link is ${otherSeq}: the newest ${removed === 1 ? 'link and its event were' : `${removed} links and their events were`} removed.`;
    }
    case 'head-behind':
      return `The last link is ${otherSeq}, past the chain’s head at link ${seq}: links were added outside the chain, or the head was moved back.`;
    case 'head-differs':
      return `Link ${seq} is not the link the chain’s head recorded: the newest link was rewritten.`;
    case 'head-missing':
      return `The chain’s head is gone (the last link is ${otherSeq}): its row was removed.`;
  }
}

/** Checks the whole system trail against its hash chain (see migrations/20261204150000-create-audit-chain.ts). */
export async function checkTrailChain(sequelize: Sequelize): Promise<TrailCheckDto> {
  const row = (await sequelize.query<CheckRow>(CHECK_QUERY, { type: QueryTypes.SELECT, plain: true, replacements: { limit: TRAIL_CHECK_PROBLEM_LIMIT } }))!;
  const problemCount = Number(row.problem_count);
  return {
    intact: problemCount === 0,
    events: Number(row.events),
    head: row.head_seq === null || row.head_hash === null ? null : { seq: Number(row.head_seq), hash: row.head_hash },
    checkedAt: new Date().toISOString(),
    problems: row.listed.map(problemSentence),
    problemCount,
  };
}
