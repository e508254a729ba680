import type { Migration } from "kysely";
import * as initial from "./20261201220000_initial";
import * as accounts from "./20261201230000_accounts";
import * as analyses from "./20261201234500_analyses";
import * as rateLimits from "./20261202070000_rate_limits";
import * as publicLabs from "./20261202130000_public_labs";
import * as analysisRuns from "./20261202131000_analysis_runs";
import * as networkStructures from "./20261202140000_network_structures";
import * as distributedBases from "./20261202160000_distributed_bases";
import * as basisRunTraces from "./20261204180000_basis_run_traces";
import * as basisRunIntegerCandidates from "./20261204220000_basis_run_integer_candidates";

/**
 * Every migration, keyed by its file name without extension, in the order they run.
 * A static map (rather than reading the folder at run time) so the built server bundle knows
 * them too; tests/app/db/migrations.test.ts checks that it lists every file in this folder.
 */
export const migrations: Record<string, Migration> = {
  "20261201220000_initial": initial,
  "20261201230000_accounts": accounts,
  "20261201234500_analyses": analyses,
  "20261202070000_rate_limits": rateLimits,
  "20261202130000_public_labs": publicLabs,
  "20261202131000_analysis_runs": analysisRuns,
  "20261202140000_network_structures": networkStructures,
  "20261202160000_distributed_bases": distributedBases,
  "20261204180000_basis_run_traces": basisRunTraces,
  "20261204220000_basis_run_integer_candidates": basisRunIntegerCandidates,
};
