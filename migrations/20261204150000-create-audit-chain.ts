import type { MigrationContext } from '@server/database/migrate';

/**
 * A hash chain over the audit trail, so that a removed, changed or slipped-in trail line shows even
 * when someone with the database owner's rights switched the append-only triggers off. Each event
 * gets one link: seq (1, 2, 3, ... in commit order) and the SHA-256 of the previous link's hash, seq
 * and every column of the event. A one-row head remembers the newest link, so removing the newest
 * events with their links shows too. `audit_chain_hash` is the only definition of a link's hash:
 * linking and checking (server/audit/trail-check.ts) both call it.
 */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  const sql = (statement: string) => queryInterface.sequelize.query(statement, { transaction });

  // No event may be written between linking the existing ones and the trigger that links new ones.
  await sql('LOCK TABLE audit_events IN SHARE ROW EXCLUSIVE MODE');

  // No foreign key to the event: a link must outlive a removed event, as the evidence of it.
  await sql(`
    CREATE TABLE audit_chain_links (
      seq bigint PRIMARY KEY CHECK (seq >= 1),
      event_id bigint NOT NULL UNIQUE,
      hash char(64) NOT NULL CHECK (hash ~ '^[0-9a-f]{64}$')
    )`);
  await sql(`
    CREATE TRIGGER audit_chain_links_append_only BEFORE UPDATE OR DELETE ON audit_chain_links
      FOR EACH ROW EXECUTE FUNCTION refuse_audit_change()`);
  await sql(`
    CREATE TRIGGER audit_chain_links_no_truncate BEFORE TRUNCATE ON audit_chain_links
      FOR EACH STATEMENT EXECUTE FUNCTION refuse_audit_change()`);

  // hash is null until the first link.
  await sql(`
    CREATE TABLE audit_chain_head (
      one_row boolean PRIMARY KEY DEFAULT true CHECK (one_row),
      seq bigint NOT NULL CHECK (seq >= 0),
      hash char(64)
    )`);
  await sql('INSERT INTO audit_chain_head (seq, hash) VALUES (0, NULL)');
  await sql(`
    CREATE FUNCTION refuse_audit_chain_head_change() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP = 'UPDATE' THEN
        IF NEW.seq = OLD.seq + 1 AND EXISTS (SELECT FROM audit_chain_links WHERE seq = NEW.seq AND hash = NEW.hash) THEN
          RETURN NEW;
        END IF;
      END IF;
      RAISE EXCEPTION 'the audit chain''s head only moves forward, onto the link just added';
    END $$`);
  await sql(`
    CREATE TRIGGER audit_chain_head_forward_only BEFORE UPDATE OR DELETE ON audit_chain_head
      FOR EACH ROW EXECUTE FUNCTION refuse_audit_chain_head_change()`);
  await sql(`
    CREATE TRIGGER audit_chain_head_no_truncate BEFORE TRUNCATE ON audit_chain_head
      FOR EACH STATEMENT EXECUTE FUNCTION refuse_audit_chain_head_change()`);

  // The event in a fixed text form: a JSON array (jsonb's text is canonical: its keys sorted, one
  // spacing), so no field can borrow characters from its neighbour; times in UTC to the microsecond.
  await sql(`
    CREATE FUNCTION audit_chain_hash(previous_hash char(64), seq bigint, event audit_events) RETURNS char(64)
      LANGUAGE sql STABLE AS $$
      SELECT encode(sha256(convert_to(jsonb_build_array(
        previous_hash, seq,
        event.id, event.actor_id, event.action, event.target_type, event.target_id, event.details,
        to_char(event.created_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"')
      )::text, 'UTF8')), 'hex')
    $$`);
  // The head's row lock serialises the chain: one link at a time, each onto the one before.
  await sql(`
    CREATE FUNCTION append_audit_chain_link(event audit_events) RETURNS void LANGUAGE plpgsql AS $$
    DECLARE
      head audit_chain_head;
      next_hash char(64);
    BEGIN
      SELECT * INTO STRICT head FROM audit_chain_head FOR UPDATE;
      next_hash := audit_chain_hash(head.hash, head.seq + 1, event);
      INSERT INTO audit_chain_links (seq, event_id, hash) VALUES (head.seq + 1, event.id, next_hash);
      UPDATE audit_chain_head SET seq = head.seq + 1, hash = next_hash;
    END $$`);

  await sql(`
    DO $$
    DECLARE
      event audit_events;
    BEGIN
      FOR event IN SELECT * FROM audit_events ORDER BY id LOOP
        PERFORM append_audit_chain_link(event);
      END LOOP;
    END $$`);

  // Deferred to the commit: by then the transaction holds every other lock it takes (a run's, a
  // booking's), so waiting for the head cannot deadlock with them; a rolled-back event never links,
  // so seq has no gaps.
  await sql(`
    CREATE FUNCTION link_audit_event() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM append_audit_chain_link(NEW);
      RETURN NULL;
    END $$`);
  await sql(`
    CREATE CONSTRAINT TRIGGER audit_events_chained AFTER INSERT ON audit_events
      DEFERRABLE INITIALLY DEFERRED
      FOR EACH ROW EXECUTE FUNCTION link_audit_event()`);
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  const sql = (statement: string) => queryInterface.sequelize.query(statement, { transaction });
  await sql('DROP TRIGGER audit_events_chained ON audit_events');
  await sql('DROP FUNCTION link_audit_event(), append_audit_chain_link(audit_events), audit_chain_hash(char, bigint, audit_events)');
  await sql('DROP TABLE audit_chain_head, audit_chain_links');
  await sql('DROP FUNCTION refuse_audit_chain_head_change()');
}
