import { DEMO_NETWORKS as STARTERS } from "../../../../app/networks/demos";
import { DEMO_NETWORKS as SEEDED } from "../../../../seeds/demo-data";
import { seededRandom } from "../../../support/prng";
import { randomNetworkCsv } from "../random-network";

/** Every demo network (starting points and every seeded version) and 40 seeded random networks, as CSV. */
export function roundTripCorpus(): { name: string; csv: string }[] {
  const out: { name: string; csv: string }[] = [];
  for (const d of STARTERS) out.push({ name: `starter ${d.id}`, csv: d.csv });
  for (const n of SEEDED) n.versions.forEach((v, i) => out.push({ name: `seed ${n.name} v${i + 1}`, csv: v.csv }));
  const rand = seededRandom(20261202);
  for (let i = 0; i < 40; i++) out.push({ name: `random ${i + 1}`, csv: randomNetworkCsv(rand) });
  // Constant species travel through every format: the corpus must hold some, or the check is blind.
  if (!out.some((c) => /^\s*#\s*constant\s*:/im.test(c.csv))) throw new Error("no demo network holds a species constant");
  return out;
}
