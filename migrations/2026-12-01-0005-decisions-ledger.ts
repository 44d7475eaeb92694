import { sql, type Kysely } from "kysely";

// The director's decision and what follows from it. An approved request becomes a ToO
// block (blocks.too_request_id); every block it cut into leaves a displacement record;
// the time-owed ledger books minutes per program and semester; schedule_changes feeds
// the night assistants' queue until they acknowledge; block_executions is the night log.
export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`
    ALTER TABLE blocks ADD COLUMN too_request_id uuid REFERENCES too_requests (id);
    CREATE UNIQUE INDEX blocks_one_per_request ON blocks (too_request_id) WHERE too_request_id IS NOT NULL;

    CREATE TABLE consortium_settings (
      key text PRIMARY KEY,
      value jsonb NOT NULL
    );
    -- Credit 1 minute owed per minute displaced (the consortium may change it).
    INSERT INTO consortium_settings (key, value) VALUES ('credit_ratio', '1'), ('interrupt_setup_minutes', '10');

    CREATE TABLE request_decisions (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      request_id uuid NOT NULL REFERENCES too_requests (id),
      decision text NOT NULL CHECK (decision IN ('approve', 'decline', 'return')),
      telescope_id uuid REFERENCES telescopes (id),
      slot_start timestamptz,
      slot_end timestamptz,
      note text NOT NULL DEFAULT '' CHECK (length(note) <= 4000),
      decided_by uuid NOT NULL REFERENCES users (id),
      decided_at timestamptz NOT NULL DEFAULT now(),
      CHECK (decision <> 'approve' OR (telescope_id IS NOT NULL AND slot_end > slot_start)),
      CHECK (decision <> 'decline' OR length(note) > 0)
    );
    CREATE UNIQUE INDEX request_decisions_one_approval ON request_decisions (request_id) WHERE decision = 'approve';

    CREATE TABLE displacements (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      request_id uuid NOT NULL REFERENCES too_requests (id),
      too_block_id uuid REFERENCES blocks (id) ON DELETE SET NULL,
      -- The displaced block may be removed by the splice: keep what it was.
      block_id uuid NOT NULL,
      telescope_id uuid NOT NULL REFERENCES telescopes (id),
      program_id uuid NOT NULL REFERENCES programs (id),
      observer_user_id uuid REFERENCES users (id),
      starts_at timestamptz NOT NULL,
      ends_at timestamptz NOT NULL,
      minutes numeric NOT NULL CHECK (minutes > 0),
      change text NOT NULL CHECK (change IN ('remove', 'trim-end', 'trim-start', 'split')),
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX displacements_program_idx ON displacements (program_id);
    CREATE INDEX displacements_observer_idx ON displacements (observer_user_id);

    CREATE TABLE ledger_entries (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      semester_id uuid NOT NULL REFERENCES semesters (id),
      program_id uuid NOT NULL REFERENCES programs (id),
      partner_id uuid NOT NULL REFERENCES partners (id),
      -- charge: ToO time used; credit: owed to a displaced program; repay: payback given.
      kind text NOT NULL CHECK (kind IN ('charge', 'credit', 'repay')),
      minutes numeric NOT NULL CHECK (minutes > 0),
      request_id uuid REFERENCES too_requests (id),
      displacement_id uuid REFERENCES displacements (id),
      block_id uuid,
      note text NOT NULL DEFAULT '',
      created_by uuid REFERENCES users (id),
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX ledger_entries_program_idx ON ledger_entries (program_id, semester_id);

    CREATE TABLE schedule_changes (
      id bigserial PRIMARY KEY,
      telescope_id uuid NOT NULL REFERENCES telescopes (id),
      at timestamptz NOT NULL DEFAULT now(),
      kind text NOT NULL CHECK (kind IN ('override', 'displaced', 'moved', 'payback', 'removed')),
      block_id uuid,
      request_id uuid REFERENCES too_requests (id),
      starts_at timestamptz NOT NULL,
      ends_at timestamptz NOT NULL,
      summary text NOT NULL
    );
    CREATE INDEX schedule_changes_telescope_idx ON schedule_changes (telescope_id, at);

    CREATE TABLE change_acknowledgements (
      id bigserial PRIMARY KEY,
      telescope_id uuid NOT NULL REFERENCES telescopes (id),
      user_id uuid NOT NULL REFERENCES users (id),
      -- Every change with an id up to this one has been seen.
      through_change_id bigint NOT NULL,
      at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX change_acknowledgements_idx ON change_acknowledgements (telescope_id, at DESC);

    CREATE TABLE block_executions (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      block_id uuid NOT NULL REFERENCES blocks (id) ON DELETE CASCADE,
      outcome text NOT NULL CHECK (outcome IN ('executed', 'partial', 'aborted', 'weather', 'technical')),
      minutes_used numeric CHECK (minutes_used >= 0),
      note text NOT NULL DEFAULT '' CHECK (length(note) <= 4000),
      logged_by uuid NOT NULL REFERENCES users (id),
      logged_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX block_executions_block_idx ON block_executions (block_id, logged_at DESC);
  `.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`
    DROP TABLE IF EXISTS block_executions, change_acknowledgements, schedule_changes, ledger_entries,
      displacements, request_decisions, consortium_settings;
    DROP INDEX IF EXISTS blocks_one_per_request;
    ALTER TABLE blocks DROP COLUMN IF EXISTS too_request_id;
  `.execute(db);
}
