import { execFile, spawnSync } from "node:child_process";
import { copyFileSync, mkdirSync, mkdtempSync, readdirSync, rmSync, symlinkSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { afterAll, describe, expect, it } from "vitest";

const root = resolve(__dirname, "..", "..");
const launcher = join(root, "scripts", "cli.mjs");

interface Outcome {
  status: number | null;
  stdout: string;
  stderr: string;
}

const run = (script: string, args: string[], cwd = root): Outcome => {
  const r = spawnSync(process.execPath, [script, ...args], { cwd, encoding: "utf8", timeout: 60_000 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
};

const runAsync = (script: string, args: string[], cwd: string) =>
  new Promise<Outcome>((done) => {
    execFile(process.execPath, [script, ...args], { cwd, encoding: "utf8", timeout: 60_000 }, (error, stdout, stderr) =>
      done({ status: error ? ((error as { code?: number }).code ?? null) : 0, stdout, stderr }),
    );
  });

// A throw-away project with the real launcher and a tiny domain/cli/main.ts, so sources can be
// edited without touching the real tree; node_modules is linked for esbuild.
const projects: string[] = [];
function scratchProject(message: string): { dir: string; script: string; write: (rel: string, text: string) => void } {
  const dir = mkdtempSync(join(tmpdir(), "cli-launcher-"));
  projects.push(dir);
  const write = (rel: string, text: string) => {
    mkdirSync(join(dir, rel, ".."), { recursive: true });
    writeFileSync(join(dir, rel), text);
  };
  mkdirSync(join(dir, "scripts"));
  copyFileSync(launcher, join(dir, "scripts", "cli.mjs"));
  symlinkSync(join(root, "node_modules"), join(dir, "node_modules"));
  write("tsconfig.json", "{}\n");
  write("domain/cli/message.ts", `export const message: string = ${JSON.stringify(message)};\n`);
  write(
    "domain/cli/main.ts",
    [
      `import { message } from "./message";`,
      `export async function main(argv: readonly string[]): Promise<number> {`,
      `  if (argv[0] === "fail") { process.stderr.write("error: asked to fail\\n"); return 2; }`,
      `  if (argv[0] === "code") return Number(argv[1]);`,
      `  process.stdout.write(message + " " + argv.join(" ") + "\\n");`,
      `  return 0;`,
      `}`,
      ``,
    ].join("\n"),
  );
  return { dir, script: join(dir, "scripts", "cli.mjs"), write };
}

const bundles = (dir: string) => readdirSync(join(dir, ".cache", "cli"));

afterAll(() => {
  for (const dir of projects) rmSync(dir, { recursive: true, force: true });
});

describe("scripts/cli.mjs (bundled CLI launcher)", () => {
  it("builds a bundle on first start, reuses it, and rebuilds when a source changes", () => {
    const p = scratchProject("first");
    expect(run(p.script, ["a", "b"], p.dir)).toMatchObject({ status: 0, stdout: "first a b\n" });
    const built = bundles(p.dir);
    expect(built).toHaveLength(1);
    expect(run(p.script, ["again"], p.dir)).toMatchObject({ status: 0, stdout: "first again\n" });
    expect(bundles(p.dir)).toEqual(built);

    p.write("domain/cli/message.ts", `export const message: string = "second, edited";\n`);
    expect(run(p.script, ["x"], p.dir)).toMatchObject({ status: 0, stdout: "second, edited x\n" });
    expect(bundles(p.dir)).not.toEqual(built);
  });

  it("rebuilds when a file is added under domain/ even if nothing else changed", () => {
    const p = scratchProject("same");
    run(p.script, [], p.dir);
    const before = bundles(p.dir);
    p.write("domain/extra/unused.ts", "export const unused = 1;\n");
    expect(run(p.script, ["y"], p.dir)).toMatchObject({ status: 0, stdout: "same y\n" });
    expect(bundles(p.dir).filter((b) => !before.includes(b))).toHaveLength(1);
  });

  it("passes exit codes and standard error through", () => {
    const p = scratchProject("codes");
    expect(run(p.script, ["fail"], p.dir)).toMatchObject({ status: 2, stdout: "", stderr: "error: asked to fail\n" });
    expect(run(p.script, ["code", "3"], p.dir).status).toBe(3);
    expect(run(p.script, ["code", "0"], p.dir).status).toBe(0);
  });

  it("reports a source that does not compile with its location and exit code 2", () => {
    const p = scratchProject("broken");
    p.write("domain/cli/message.ts", "export const message: string = (;\n");
    const r = run(p.script, [], p.dir);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/cannot build the CLI/);
    expect(r.stderr).toMatch(/message\.ts:1:\d+/);
  });

  it("lets concurrent first starts share one complete bundle", async () => {
    const p = scratchProject("together");
    const outcomes = await Promise.all([1, 2, 3].map((i) => runAsync(p.script, [`${i}`], p.dir)));
    outcomes.forEach((o, i) => expect(o).toMatchObject({ status: 0, stdout: `together ${i + 1}\n` }));
    expect(bundles(p.dir)).toHaveLength(1);
  });

  it("runs the real CLI: groebner output, and errors on stderr with exit code 2", () => {
    const dir = mkdtempSync(join(tmpdir(), "cli-real-"));
    projects.push(dir);
    writeFileSync(join(dir, "ideal.txt"), "vars: x, y\norder: lex\nx^2 - y\nx*y - 1\n");
    const ok = run(launcher, ["groebner", join(dir, "ideal.txt")]);
    // x^2 = y and xy = 1 give x = y^2 and y^3 = 1 (checked by hand).
    expect(ok).toMatchObject({ status: 0, stdout: "y^3 - 1\nx - y^2\n" });
    const missing = run(launcher, ["groebner", join(dir, "missing.txt")]);
    expect(missing.status).toBe(2);
    expect(missing.stderr).toMatch(/^error: cannot read .*missing\.txt/);
    expect(missing.stdout).toBe("");
    expect(run(launcher, ["no-such-command"]).status).toBe(2);
  });
});
