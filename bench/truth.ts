/**
 * `npm run bench -- --truth [--count N] [--seed S] [--timeout SECONDS]`: positive steady-state counts
 * of `analyse` on N seeded random networks against multistart Newton and Singular (see
 * lib/steady-state-truth.ts). Prints a summary table and every disagreement with its reproduction;
 * exit code 1 when any disagrees.
 */
import { existsSync } from "node:fs";
import { checkCase, randomCase, reproduction, SINGULAR, type TruthOutcome } from "./lib/steady-state-truth";

export function runTruth(argv: readonly string[]): number {
  const flag = (name: string, fallback: number) => {
    const i = argv.indexOf(`--${name}`);
    const v = i >= 0 ? Number(argv[i + 1]) : fallback;
    if (!Number.isFinite(v) || v <= 0) throw new Error(`--${name} needs a positive number`);
    return v;
  };
  const count = flag("count", 300);
  const seed = flag("seed", 1);
  const timeoutMs = flag("timeout", 10) * 1000;
  const singular = existsSync(SINGULAR);
  const outcomes: TruthOutcome[] = [];
  for (let i = 0; i < count; i++) {
    const c = randomCase(seed + i);
    let o: TruthOutcome;
    try {
      o = checkCase(c, { timeoutMs, singular, starts: 200 });
    } catch (e) {
      o = { case: c, ours: "undecided", newton: 0, singular: null, elapsedMs: 0, problems: [`crashed: ${(e as Error).stack}`] };
    }
    outcomes.push(o);
    if (o.problems.length > 0) console.log(`DISAGREES ${reproduction(o)}\n`);
  }
  const by = (f: (o: TruthOutcome) => boolean) => outcomes.filter(f).length;
  const worst = outcomes.reduce((m, o) => Math.max(m, o.elapsedMs - timeoutMs), -Infinity);
  console.log(`networks                 ${count} (seeds ${seed}..${seed + count - 1}), budget ${timeoutMs / 1000} s each, Singular ${singular ? "yes" : "not installed"}`);
  console.log(`finite, ≥ 1 state        ${by((o) => typeof o.ours === "number" && o.ours > 0)}`);
  console.log(`finite, ≥ 2 states       ${by((o) => typeof o.ours === "number" && o.ours > 1)}`);
  console.log(`finite, none             ${by((o) => o.ours === 0)}`);
  console.log(`continuum                ${by((o) => o.ours === "continuum")}`);
  console.log(`undecided (budget)       ${by((o) => o.ours === "undecided")}`);
  console.log(`Singular decided         ${by((o) => o.singular !== null)}`);
  console.log(`slowest vs budget        ${worst > 0 ? "+" : ""}${worst} ms (limit +1000 ms)`);
  console.log(`median time              ${outcomes.map((o) => o.elapsedMs).sort((a, b) => a - b)[Math.floor(count / 2)]} ms`);
  const bad = by((o) => o.problems.length > 0);
  console.log(`disagreements            ${bad}`);
  return bad > 0 ? 1 : 0;
}
