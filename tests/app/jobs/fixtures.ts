/** Shared setup for the worker and analyses tests: a lab with people, networks from fixture files, job rows. */
import { readFileSync } from "node:fs";
import type { Kysely } from "kysely";
import type { Database } from "~/db/schema";
import { insertNetwork } from "~/networks/networks.server";
import { insertJob, type NewJob } from "~/analyses/repository.server";
import type { AnalysisParams } from "~/analyses/params";
import { makeLab, makeUser } from "../auth/fixtures";

export const fixtureCsv = (name: string) => readFileSync(`tests/fixtures/networks/${name}.csv`, "utf8");

export const analysisParams = (over: Partial<AnalysisParams> = {}): AnalysisParams => ({
  order: null,
  free: [],
  rateMode: "numeric",
  rateValues: {},
  initial: null,
  timeLimitSeconds: 60,
  maxBasisSize: 2000,
  maxTerms: 20000,
  notify: false,
  ...over,
});

export async function makeNetwork(db: Kysely<Database>, labId: string, authorId: string, name: string, csv: string) {
  const { network, version } = await insertNetwork(db, { labId, name, description: "", tags: [], csv, changeNote: "test", authorId });
  return { networkId: network.id, versionId: version.id };
}

export async function makeJob(db: Kysely<Database>, job: Omit<NewJob, "params" | "notify" | "parentId"> & { params: object; parentId?: string | null; notify?: boolean }) {
  return insertJob(db, { ...job, params: job.params as never, parentId: job.parentId ?? null, notify: job.notify ?? false });
}

export async function makeTeam(db: Kysely<Database>, slug = "alpha") {
  const owner = await makeUser(db, `owner@${slug}.test`, "Owner");
  const lab = await makeLab(db, slug, `Lab ${slug}`, [[owner.id, "owner"]]);
  return { owner, lab };
}

/** Polls `check` until it returns a value, or fails after `ms`. */
export async function waitFor<T>(check: () => Promise<T | undefined | null | false>, ms: number, what: string): Promise<T> {
  const deadline = Date.now() + ms;
  for (;;) {
    const v = await check();
    if (v) return v;
    if (Date.now() > deadline) throw new Error(`timed out after ${ms} ms waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}
