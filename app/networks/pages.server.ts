/**
 * What the network pages and the JSON API load and do, after the route has checked permissions.
 * Route modules stay short: authenticate → parse → authorize → call one of these → respond.
 */
import type { Kysely } from "kysely";
import type { NetworkStructure } from "@domain/network/index";
import type { Database } from "~/db/schema";
import { apiError } from "~/permissions/api-errors";
import type { LabAccess } from "~/permissions/permissions.server";
import { hasRole } from "~/permissions/roles";
import { diffNetworks, type NetworkDiff } from "./diff";
import { findNetwork, findNetworkWithLatest, findVersion, latestVersion, listNetworks, listVersions, type NetworkRecord, type VersionRecord } from "./networks.server";
import { checkNetworkFile, odesOf } from "./structure.server";
import { structureState, structureStates, type StructureState } from "./structure-store.server";
import { contentHash } from "./networks.server";
import type { SpeciesOde } from "@domain/steady-state/ode-terms";
import { networkPath } from "./paths";
import { verdictCard, type LatestAnalysis, type VerdictCard } from "./verdict";
import { listJobs } from "~/analyses/repository.server";
import { analysisPath, newAnalysisPath } from "~/analyses/paths";
import type { AnalysisResult } from "~/analyses/result-types";
import type { NetworkTableRow } from "./ui/network-table";
import { notFound } from "~/shared/responses";

export { networkPath };

/** JSON-safe forms, shared by pages and API. */
export function networkJson(n: NetworkRecord) {
  return {
    id: n.id,
    name: n.name,
    description: n.description,
    tags: n.tags,
    archived: n.archivedAt !== null,
    archivedAt: n.archivedAt?.toISOString() ?? null,
    createdAt: n.createdAt.toISOString(),
    updatedAt: n.updatedAt.toISOString(),
  };
}

export function versionJson(v: VersionRecord, options: { csv?: boolean } = {}) {
  return {
    number: v.number,
    contentHash: v.contentHash,
    changeNote: v.changeNote,
    author: v.authorName,
    createdAt: v.createdAt.toISOString(),
    ...(options.csv ? { csv: v.csv } : {}),
  };
}

export type NetworkJson = ReturnType<typeof networkJson>;
export type VersionJson = ReturnType<typeof versionJson>;

export async function networkTableRows(db: Kysely<Database>, access: LabAccess, includeArchived: boolean): Promise<NetworkTableRow[]> {
  const entries = await listNetworks(db, access.lab.id, { includeArchived });
  const states = await structureStates(db, entries.map((n) => n.latest.csv));
  return entries.map((n) => {
    // Species and reactions come from the file (a parse, no algebra); the deficiency from the
    // stored structure, null while the worker computes it.
    const file = checkNetworkFile(n.latest.csv);
    const state = states.get(contentHash(n.latest.csv));
    const species = file.ok ? [...file.network.species] : [];
    return {
      id: n.id,
      name: n.name,
      href: networkPath(access.lab.slug, n.id),
      tags: n.tags,
      archived: n.archivedAt !== null,
      species,
      speciesCount: species.length,
      reactionCount: file.ok ? file.network.reactions.length : 0,
      deficiency: state?.status === "ready" ? state.structure.deficiency : null,
      lastChange: n.latest.createdAt.toISOString(),
      author: n.latest.authorName ?? (access.lab.isPublic ? "worked example" : "(former member)"),
      version: n.latest.number,
    };
  });
}

/** The network, or a thrown 404 (also for ids of other labs: no existence leak). */
export async function requireNetwork(db: Kysely<Database>, access: LabAccess, networkId: string | undefined, api = false): Promise<NetworkRecord> {
  const network = await findNetwork(db, access.lab.id, networkId);
  if (!network) {
    if (api) throw apiError("not_found", "No such network in this lab.");
    throw notFound();
  }
  return network;
}

/** The network and its newest version (one query), or the API's 404 as requireNetwork gives it. */
export async function requireNetworkWithLatest(db: Kysely<Database>, access: LabAccess, networkId: string | undefined): Promise<{ network: NetworkRecord; latest: VersionRecord }> {
  const found = await findNetworkWithLatest(db, access.lab.id, networkId);
  if (!found) throw apiError("not_found", "No such network in this lab.");
  return found;
}

/** `?v=3` or the newest version; a missing number is a 404. */
export async function requireVersion(db: Kysely<Database>, network: NetworkRecord, raw: string | null | undefined, api = false): Promise<VersionRecord> {
  const version = raw == null || raw === "" ? await latestVersion(db, network.id) : await findVersion(db, network.id, Number(raw));
  if (!version) {
    if (api) throw apiError("not_found", `Version ${raw} of this network does not exist.`);
    throw notFound(`No version ${raw}`);
  }
  return version;
}

/** The newest of `versions` (newest first) for no `raw`, else the one numbered `raw`; undefined when there is none. */
function pickVersion(versions: readonly VersionRecord[], raw: string | null): VersionRecord | undefined {
  if (raw == null || raw === "") return versions[0];
  const number = Number(raw);
  return versions.find((v) => v.number === number);
}

export interface NetworkPageData {
  lab: { slug: string; name: string; isPublic: boolean };
  network: NetworkJson;
  version: VersionJson;
  latestNumber: number;
  versions: VersionJson[];
  /** Null until the worker has computed it (`structureStatus` says why). */
  structure: NetworkStructure | null;
  structureStatus: StructureState["status"];
  structureProblem?: string;
  /** From the file alone (no structure needed), so the page shows them while the structure is pending. */
  odes: SpeciesOde[];
  canEdit: boolean;
  canDelete: boolean;
  /** Reading a public lab (the worked examples) without being a member. */
  guest: boolean;
  /** Null until the structure is ready: every line rests on it. */
  verdict: VerdictCard | null;
}

/** The newest finished analysis of exactly this version, for the verdict card. */
async function latestAnalysisOf(db: Kysely<Database>, labSlug: string, labId: string, networkId: string, versionNumber: number): Promise<LatestAnalysis | null> {
  // Only finished runs of exactly this version: a few rows, not the network's whole history.
  const jobs = await listJobs(db, labId, { kind: "analysis", networkId, versionNumber, status: "succeeded", limit: 5 });
  const job = jobs.find((j) => j.result);
  if (!job) return null;
  return {
    href: analysisPath(labSlug, job.id),
    result: job.result as unknown as AnalysisResult,
    rateMode: job.params.rateMode === "symbolic" ? "symbolic" : "numeric",
    finishedAt: (job.finished_at ?? job.created_at).toISOString(),
  };
}

export async function networkPageData(db: Kysely<Database>, access: LabAccess, network: NetworkRecord, versionParam: string | null): Promise<NetworkPageData> {
  // One query for the list and the version shown (the newest, or ?v=N from the same list).
  const versions = await listVersions(db, network.id);
  const version = pickVersion(versions, versionParam);
  if (!version) throw notFound(`No version ${versionParam}`);
  const state = await structureState(db, version.csv);
  const canEdit = hasRole(access.role, "editor");
  const latest = await latestAnalysisOf(db, access.lab.slug, access.lab.id, network.id, version.number);
  return {
    lab: { slug: access.lab.slug, name: access.lab.name, isPublic: access.lab.isPublic },
    network: networkJson(network),
    version: versionJson(version),
    latestNumber: versions[0]!.number,
    versions: versions.map((v) => versionJson(v)),
    ...structureFields(state),
    odes: odesOf(version.csv),
    canEdit,
    canDelete: hasRole(access.role, "owner"),
    guest: access.guest,
    verdict: state.status === "ready" ? verdictCard(state.structure, latest, { newAnalysis: canEdit ? newAnalysisPath(access.lab.slug, network.id, version.number) : null }) : null,
  };
}

/** `structure`, `structureStatus` (and the reason of a failure) for pages and the JSON API. */
export function structureFields(state: StructureState): { structure: NetworkStructure | null; structureStatus: StructureState["status"]; structureProblem?: string } {
  if (state.status === "ready") return { structure: state.structure, structureStatus: "ready" };
  if (state.status === "failed") return { structure: null, structureStatus: "failed", structureProblem: state.message };
  return { structure: null, structureStatus: "pending" };
}

export interface VersionDiffData {
  from: VersionJson;
  to: VersionJson;
  /** Null while either side's structure is still being computed. */
  diff: NetworkDiff | null;
}

export async function versionDiff(db: Kysely<Database>, from: VersionRecord, to: VersionRecord): Promise<VersionDiffData> {
  const states = await structureStates(db, [from.csv, to.csv]);
  const a = states.get(contentHash(from.csv));
  const b = states.get(contentHash(to.csv));
  const diff = a?.status === "ready" && b?.status === "ready" ? diffNetworks(a.structure, b.structure) : null;
  return { from: versionJson(from), to: versionJson(to), diff };
}
