#!/usr/bin/env node
// Fast start for `npm run -s cli`: runs domain/cli/main.ts from a bundle in .cache/cli/ instead of
// transpiling TypeScript on every start (tsx costs 0.5–0.8 s; plain Node with a bundle ~0.1 s).
//
// The bundle's folder name carries a fingerprint of every path, size and mtime under domain/ (plus
// tsconfig.json and this file), so any edit, added, removed or renamed file selects a new bundle;
// a missing one is built with esbuild, written to a temporary file and renamed into place, so
// concurrent starts never see a half-written bundle. Warm start: one directory walk (a few ms).
import { createHash } from "node:crypto";
import { mkdirSync, readdirSync, renameSync, rmSync, statSync, existsSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const root = join(dirname(fileURLToPath(import.meta.url)), "..");
const cacheDir = join(root, ".cache", "cli");
const entry = join(root, "domain", "cli", "main.ts");
const self = fileURLToPath(import.meta.url);

/** Fingerprint of the sources the bundle depends on; changes whenever any of them may have. */
export function sourceFingerprint(projectRoot = root) {
  const hash = createHash("sha1");
  const visit = (dir) => {
    const entries = readdirSync(dir, { withFileTypes: true }).sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
    for (const e of entries) {
      const path = join(dir, e.name);
      if (e.isDirectory()) visit(path);
      else if (e.isFile()) {
        const s = statSync(path);
        hash.update(`${path}\0${s.size}\0${s.mtimeMs}\n`);
      }
    }
  };
  visit(join(projectRoot, "domain"));
  for (const extra of [join(projectRoot, "tsconfig.json"), self]) {
    const s = statSync(extra, { throwIfNoEntry: false });
    hash.update(`${extra}\0${s ? `${s.size}\0${s.mtimeMs}` : "missing"}\n`);
  }
  return hash.digest("hex").slice(0, 16);
}

/** Path of an up-to-date bundle of domain/cli/main.ts, building it first when needed. */
export async function ensureBundle() {
  const dir = join(cacheDir, sourceFingerprint());
  const bundle = join(dir, "main.mjs");
  if (existsSync(bundle)) return bundle;
  mkdirSync(cacheDir, { recursive: true });
  const temp = `${dir}.${process.pid}.${Date.now()}.tmp`;
  const { build } = await import("esbuild");
  try {
    await build({
      entryPoints: { main: entry },
      outdir: temp,
      outExtension: { ".js": ".mjs" },
      // Code splitting keeps each subcommand (and its packages, e.g. papaparse) out of the others' start-up.
      splitting: true,
      bundle: true,
      platform: "node",
      format: "esm",
      target: "node20",
      packages: "external", // node_modules resolve from .cache/cli/… up to the project root
      keepNames: true,
      logLevel: "silent",
      tsconfig: join(root, "tsconfig.json"),
    });
    try {
      renameSync(temp, dir);
    } catch (e) {
      // Another start renamed an identical build into place first.
      if (!existsSync(bundle)) throw e;
      rmSync(temp, { recursive: true, force: true });
    }
  } catch (e) {
    rmSync(temp, { recursive: true, force: true });
    throw e;
  }
  removeOldBundles(dir);
  return bundle;
}

// Best effort; bundles younger than a minute are left alone in case another start still loads one.
function removeOldBundles(keep) {
  const now = Date.now();
  for (const name of readdirSync(cacheDir)) {
    const path = join(cacheDir, name);
    if (path === keep) continue;
    try {
      if (now - statSync(path).mtimeMs > 60_000) rmSync(path, { recursive: true, force: true });
    } catch {
      /* already gone */
    }
  }
}

async function run() {
  let bundle;
  try {
    bundle = await ensureBundle();
  } catch (e) {
    const detail = e && Array.isArray(e.errors) && e.errors.length > 0
      ? e.errors.map((m) => `${m.location ? `${m.location.file}:${m.location.line}:${m.location.column}: ` : ""}${m.text}`).join("\n")
      : String(e && e.message ? e.message : e);
    process.stderr.write(`error: cannot build the CLI from domain/cli/main.ts:\n${detail}\n`);
    process.exitCode = 2;
    return;
  }
  const { main } = await import(pathToFileURL(bundle).href);
  process.exitCode = await main(process.argv.slice(2));
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) await run();
