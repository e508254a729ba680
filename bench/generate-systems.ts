/**
 * Writes bench/systems/<name>.txt for every standard benchmark system (see lib/systems.ts for
 * the definitions and their sources). Run: `npx tsx bench/generate-systems.ts` (add `--check`
 * to verify the committed files are up to date without writing).
 */
import { readFileSync, writeFileSync, existsSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { formatSystemFile } from "./lib/system-file";
import { standardSystems } from "./lib/systems";

const systemsDir = join(dirname(fileURLToPath(import.meta.url)), "systems");
const check = process.argv.includes("--check");
let stale = 0;
for (const s of standardSystems()) {
  const path = join(systemsDir, `${s.name}.txt`);
  const text = formatSystemFile(s.file);
  if (check) {
    if (!existsSync(path) || readFileSync(path, "utf8") !== text) {
      console.error(`stale: bench/systems/${s.name}.txt`);
      stale++;
    }
  } else {
    writeFileSync(path, text);
    console.log(`wrote bench/systems/${s.name}.txt (${s.file.vars.length} vars, ${s.file.polys.length} equations, ${s.file.order})`);
  }
}
if (stale > 0) process.exit(1);
