import { type Kysely, sql } from "kysely";

/**
 * Distributed multi-modular Gröbner bases (app/jobs/coordinator.ts). A `basis_runs` row is one
 * basis over Q that a coordinator (the process running an analysis, or the bench) spreads over the
 * workers; its `basis_tasks` are the child jobs: one image modulo a prime each (stored as bytes:
 * leading monomials, exponents and residues, encodeImage in domain/algebra/f4/multimodular.ts) or
 * one batch of the exact proof. The queue (pg-boss, `stillpoint-images`) only carries task ids;
 * these rows are what the coordinator reads and the analysis page shows (images done/needed, workers).
 * A run dies with its analysis (ON DELETE CASCADE), its tasks with the run.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    CREATE TABLE basis_runs (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      analysis_id uuid REFERENCES analyses(id) ON DELETE CASCADE,
      input jsonb NOT NULL,
      status text NOT NULL DEFAULT 'running' CHECK (status IN ('running', 'succeeded', 'failed', 'cancelled')),
      coordinator text NOT NULL,
      engine_version text NOT NULL,
      images_done integer NOT NULL DEFAULT 0,
      images_needed integer,
      primes_used jsonb,
      unlucky_primes jsonb,
      candidate jsonb,
      error text,
      created_at timestamptz NOT NULL DEFAULT now(),
      finished_at timestamptz
    )
  `.execute(db);
  await sql`CREATE INDEX basis_runs_analysis_idx ON basis_runs (analysis_id) WHERE analysis_id IS NOT NULL`.execute(db);
  await sql`
    CREATE TABLE basis_tasks (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      run_id uuid NOT NULL REFERENCES basis_runs(id) ON DELETE CASCADE,
      kind text NOT NULL CHECK (kind IN ('image', 'proof')),
      seq integer NOT NULL,
      prime integer,
      batch jsonb,
      status text NOT NULL DEFAULT 'queued' CHECK (status IN ('queued', 'running', 'done', 'failed', 'cancelled')),
      worker_id text,
      attempts integer NOT NULL DEFAULT 0,
      image bytea,
      bytes integer,
      ok boolean,
      failed_step text,
      compute_ms integer,
      enqueued_at timestamptz NOT NULL DEFAULT now(),
      started_at timestamptz,
      finished_at timestamptz,
      UNIQUE (run_id, kind, seq),
      CHECK ((kind = 'image') = (prime IS NOT NULL))
    )
  `.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("basis_tasks").execute();
  await db.schema.dropTable("basis_runs").execute();
}
