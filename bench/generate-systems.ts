/**
 * Writes bench/systems/<name>.txt for every standard benchmark system (and the network CSV of
 * the issue-4 target) (see lib/systems.ts for
 * the definitions and their sources). Run: `npx tsx bench/generate-systems.ts` (add `--check`
 * to verify the committed files are up to date without writing).
 */
import { readFileSync, writeFileSync, existsSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { formatSystemFile } from "./lib/system-file";
import { networkCsv } from "./lib/network-csv";
import { phosphorylationTwoSiteSymbolicNetwork, standardSystems } from "./lib/systems";

const systemsDir = join(dirname(fileURLToPath(import.meta.url)), "systems");
const check = process.argv.includes("--check");
let stale = 0;
const files = standardSystems().map((s) => ({
  name: `${s.name}.txt`,
  text: formatSystemFile(s.file),
  what: `${s.file.vars.length} vars, ${s.file.polys.length} equations, ${s.file.order}`,
}));
const network = phosphorylationTwoSiteSymbolicNetwork();
files.push({ name: `${network.name}.csv`, text: networkCsv(network.reactions, network.comments), what: `${network.reactions.length} reactions` });
for (const f of files) {
  const path = join(systemsDir, f.name);
  if (check) {
    if (!existsSync(path) || readFileSync(path, "utf8") !== f.text) {
      console.error(`stale: bench/systems/${f.name}`);
      stale++;
    }
  } else {
    writeFileSync(path, f.text);
    console.log(`wrote bench/systems/${f.name} (${f.what})`);
  }
}
if (stale > 0) process.exit(1);
