/**
 * npm test — everything, self-contained:
 *   1. system packages: PostgreSQL and Debian's chromium (apt-get when missing; never a downloaded browser)
 *   2. a throw-away PostgreSQL in a temp folder on a free loopback port (fsync off)
 *   3. vitest: unit and database tests (tests/**\/*.test.ts); TEST_DATABASE_URL names a migrated
 *      template database that each DB test file copies
 *   4. the built app + maildev on free ports, against a migrated and seeded database
 *   5. vitest with vitest.e2e.config.ts: browser tests (tests/e2e/**\/*.e2e.ts) in headless chromium
 * Everything is torn down even on failure; the last line is `N passed, N failed`.
 *
 * `npm test -- tests/app` runs only step 3 with those vitest filters (no build, no browser).
 * `npm test -- --e2e tests/e2e/folds.e2e.ts` runs only steps 4–5 with those filters (one browser file).
 */
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { spawn } from "node:child_process";
import { aptInstall } from "./lib/apt";
import { log } from "./lib/log";
import { type Managed, onShutdown } from "./lib/processes";
import { buildApp, startAppServer, startMaildev, startWorkerIfPresent } from "./lib/services";
import { ensureDatabase, ensurePostgresInstalled, freePort, serverUrl, startThrowawayCluster } from "./db/postgres";
import { migrate } from "./migrate";
import { seed } from "./seed";

export const CHROMIUM = "/usr/bin/chromium";
/** Upper bound for one vitest run (TEST_TIME_LIMIT_MINUTES); a hung test must not hang CI. */
const VITEST_LIMIT_MINUTES = Number(process.env.TEST_TIME_LIMIT_MINUTES ?? 30);

interface Tally {
  passed: number;
  failed: number;
  skipped: number;
}

const e2eOnly = process.argv.includes("--e2e");
const filters = process.argv.slice(2).filter((a) => a !== "--e2e");
const tmp = mkdtempSync(path.join(os.tmpdir(), "stillpoint-test-"));
// One build per run, inside the project (the server bundle resolves packages from node_modules)
// but outside build/, which every `react-router build` empties first. test-results/ is git-ignored.
const buildDir = path.join("test-results", "builds", String(process.pid));
const children: Managed[] = [];
let disposeDb: (() => void) | undefined;
let runningVitest: number | undefined;

const cleanup = onShutdown(async () => {
  if (runningVitest !== undefined) {
    try {
      process.kill(-runningVitest, "SIGTERM");
    } catch {
      /* already gone */
    }
  }
  for (const child of [...children].reverse()) await child.stop();
  try {
    disposeDb?.();
  } catch (err) {
    console.error(`[test] stopping PostgreSQL failed: ${err instanceof Error ? err.message : err}`);
  }
  rmSync(tmp, { recursive: true, force: true });
  rmSync(buildDir, { recursive: true, force: true });
});

/** Runs vitest with a JSON report beside the normal output and reads the counts from it. */
async function runVitest(label: string, args: string[], env: NodeJS.ProcessEnv): Promise<Tally> {
  const report = path.join(tmp, `${label}.json`);
  log("test", `vitest (${label}) ${args.join(" ")}`);
  const code = await new Promise<number>((resolve) => {
    const child = spawn(
      path.resolve("node_modules/.bin/vitest"),
      ["run", "--reporter=default", "--reporter=json", `--outputFile.json=${report}`, ...args],
      { stdio: "inherit", env, detached: true },
    );
    runningVitest = child.pid;
    // vitest's per-test timeout cannot interrupt a synchronous endless loop; this can.
    const watchdog = setTimeout(() => {
      log("test", `vitest (${label}) still running after ${VITEST_LIMIT_MINUTES} min; stopping it`);
      try {
        process.kill(-child.pid!, "SIGKILL");
      } catch {
        /* already gone */
      }
    }, VITEST_LIMIT_MINUTES * 60_000);
    child.on("exit", (c) => {
      runningVitest = undefined;
      clearTimeout(watchdog);
      resolve(c ?? 1);
    });
    child.on("error", () => resolve(1));
  });
  if (!existsSync(report)) {
    log("test", `vitest (${label}) wrote no report (exit ${code})`);
    return { passed: 0, failed: 1, skipped: 0 };
  }
  const json = JSON.parse(readFileSync(report, "utf8")) as {
    numPassedTests: number;
    numFailedTests: number;
    numPendingTests: number;
    numTodoTests: number;
    numFailedTestSuites: number;
  };
  const tally = {
    passed: json.numPassedTests,
    failed: json.numFailedTests,
    skipped: json.numPendingTests + json.numTodoTests,
  };
  // A file that fails to load has no failed tests but must still fail the run.
  if (code !== 0 && tally.failed === 0) tally.failed = Math.max(1, json.numFailedTestSuites);
  return tally;
}

const total: Tally = { passed: 0, failed: 0, skipped: 0 };

async function main(): Promise<void> {
  const add = (t: Tally) => {
    total.passed += t.passed;
    total.failed += t.failed;
    total.skipped += t.skipped;
  };
  const unitOnly = filters.length > 0 && !e2eOnly;

  ensurePostgresInstalled();
  if (!unitOnly && !existsSync(CHROMIUM)) aptInstall(["chromium"]);

  const pg = await startThrowawayCluster();
  disposeDb = pg.dispose;
  await ensureDatabase(pg.port, "stillpoint_template");
  await migrate(serverUrl(pg.port, "stillpoint_template"));

  const baseEnv = { ...process.env, NODE_ENV: "test", DATA_DIR: path.join(tmp, "data") };
  if (!e2eOnly) add(await runVitest("unit", filters, { ...baseEnv, TEST_DATABASE_URL: serverUrl(pg.port, "stillpoint_template") }));
  if (unitOnly) return;

  // The app under test gets its own database with the demo seed, and its own mail catcher.
  const e2eDb = serverUrl(pg.port, "stillpoint_e2e");
  await ensureDatabase(pg.port, "stillpoint_e2e");
  await migrate(e2eDb);
  await seed(e2eDb);
  const serverEntry = buildApp(buildDir, { quiet: true });
  const [appPort, smtpPort, webPort] = [await freePort(), await freePort(), await freePort()];
  children.push(await startMaildev(smtpPort, webPort));
  const appEnv = {
    ...baseEnv,
    DATABASE_URL: e2eDb,
    SMTP_PORT: String(smtpPort),
    MAILDEV_WEB_PORT: String(webPort),
    APP_URL: `http://127.0.0.1:${appPort}`,
  };
  const worker = startWorkerIfPresent({ ...appEnv, NODE_ENV: "production" }, { quiet: true });
  if (worker) children.push(worker);
  children.push(await startAppServer(appEnv, "127.0.0.1", appPort, { quiet: true, serverEntry }));
  log("test", `app on http://127.0.0.1:${appPort}, maildev on ${webPort} (SMTP ${smtpPort})`);

  add(
    await runVitest("e2e", ["--config", "vitest.e2e.config.ts", ...(e2eOnly ? filters : [])], {
      ...baseEnv,
      E2E_BASE_URL: `http://127.0.0.1:${appPort}`,
      E2E_MAILDEV_URL: `http://127.0.0.1:${webPort}`,
      E2E_DATABASE_URL: e2eDb,
      CHROMIUM_PATH: CHROMIUM,
    }),
  );
}

main()
  .then(
    () => ({ ...total, error: undefined as string | undefined }),
    (err) => ({ ...total, error: err instanceof Error ? err.message : String(err) }),
  )
  .then(async (result) => {
    await cleanup();
    if (result.error) console.error(`[test] aborted: ${result.error}`);
    const failed = result.failed + (result.error ? 1 : 0);
    if (result.skipped) console.log(`(${result.skipped} skipped)`);
    console.log(`${result.passed} passed, ${failed} failed`);
    process.exit(failed > 0 || result.passed === 0 ? 1 : 0);
  });
