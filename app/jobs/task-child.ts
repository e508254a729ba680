/**
 * The long-lived process in which a worker computes basis tasks (one modular image or one proof
 * batch of a distributed basis; app/jobs/task-runner.server.ts forks it). Long-lived so that a
 * run's input is parsed once per worker, not once per image; killed (SIGKILL) when a run is
 * cancelled mid-task, and forked again for the next one.
 */
import type { LiftCandidate, MultiModularInput, ProofBatch } from "@domain/algebra/f4/multimodular";
import type { ImageTracing, ModularImage } from "@domain/algebra/f4/multimodular";
import { adoptIntegerCandidate, decodeImageTrace, encodeImage, encodeImageBatch, imageModPrime, isDeclinedOnly, proveBatch } from "@domain/algebra/f4/multimodular";
import { Limits } from "@domain/algebra/groebner/limits";

export type TaskRequest =
  /** `trace`: the run's stored trace (null: it has none), sent with a run's first task to this process. */
  | { kind: "image"; runId: string; input: MultiModularInput; primes: number[]; deadline: number; trace?: Uint8Array | null }
  /**
   * `integer`: the candidate's integer form (encodeIntegerCandidate), sent with the first batch of
   * a candidate to this process, whose `candidate.basis` may then be empty; a later batch sends
   * the candidate without either, and gets `needs-candidate` back if this process no longer has it.
   */
  | { kind: "proof"; runId: string; input: MultiModularInput; candidate: LiftCandidate; integer?: Uint8Array; batch: ProofBatch; deadline: number };

export type TaskReply =
  /** `replayed`: of this task's primes, how many the run's trace gave (the others ran F4 afresh). */
  | { kind: "image"; bytes: Uint8Array; ms: number; replayed: number }
  | { kind: "proof"; ok: boolean; failed?: string; ms: number }
  | { kind: "needs-candidate" }
  | { kind: "error"; message: string };

// The same input object for every task of a run, so the domain's per-input cache (ring, integer
// generators, monomial table, parsed candidate) is reused; likewise one candidate object per
// (run, candidate) — the early step-3 check has a stand-in of its own. Only the latest runs are kept.
const inputs = new Map<string, MultiModularInput>();
const candidates = new Map<string, LiftCandidate>();
function keep<T>(m: Map<string, T>, key: string, value: T): T {
  const had = m.get(key);
  if (had) return had;
  m.set(key, value);
  while (m.size > 6) m.delete(m.keys().next().value!);
  return value;
}

// The last image this process computed per run: a later image (a smaller prime, as liftPrimes
// yields them largest first) with the same support is sent as residues on it. The coordinator
// adds images in prime order, so it has decoded that earlier image before it meets this one.
const lastImage = new Map<string, ModularImage>();

// Per run, the F4 run this process replays at its primes (domain/algebra/f4/trace.ts): the one
// the coordinator learnt and stored, or else the one this process learnt at its first prime. A
// replay gives the same image as F4 afresh, or declines and F4 runs.
const tracings = new Map<string, ImageTracing>();

process.on("disconnect", () => process.exit(1));
process.on("message", (raw) => {
  const req = raw as TaskRequest;
  const t0 = Date.now();
  let reply: TaskReply;
  try {
    const limits = new Limits({ deadline: req.deadline });
    if (req.kind === "image") {
      const input = keep(inputs, req.runId, req.input);
      const tracing = keep(tracings, req.runId, { trace: undefined, replayed: 0, declined: 0 });
      // The coordinator's learnt run, when it stored one: replayed from the first prime on.
      if (req.trace && tracing.trace === undefined) {
        tracing.trace = decodeImageTrace(input, req.trace);
        // The same trace as every process of the run: a prime where it declines is left to the
        // lift to set aside (ModularImage.declined), not computed afresh, while declines are rare
        // here; a trace that declines often gets its images computed afresh (and combined).
        tracing.onDecline = () => tracing.declined <= 1 + tracing.replayed / 4;
      }
      const before = tracing.replayed;
      const images = req.primes.map((p) => imageModPrime(input, p, limits, undefined, undefined, tracing));
      const like = lastImage.get(req.runId);
      const first = like && like.p > images[0].p ? like : undefined;
      const bytes = images.length === 1 ? encodeImage(images[0], first) : encodeImageBatch(images, first);
      lastImage.delete(req.runId);
      const computed = images.filter((im) => !isDeclinedOnly(im));
      if (computed.length > 0) keep(lastImage, req.runId, computed[computed.length - 1]);
      else if (like) keep(lastImage, req.runId, like);
      reply = { kind: "image", bytes, ms: Date.now() - t0, replayed: tracing.replayed - before };
    } else {
      const input = keep(inputs, req.runId, req.input);
      const key = `${req.runId}:${req.candidate.checkedWith}`;
      if (req.candidate.basis.length === 0 && !req.integer && !candidates.has(key)) {
        reply = { kind: "needs-candidate" };
      } else {
        const candidate = keep(candidates, key, req.candidate);
        if (req.integer) adoptIntegerCandidate(input, candidate, req.integer);
        const outcome = proveBatch(input, candidate, req.batch, limits);
        reply = { kind: "proof", ok: outcome.ok, ...(outcome.ok ? {} : { failed: outcome.failed }), ms: Date.now() - t0 };
      }
    }
  } catch (e) {
    reply = { kind: "error", message: (e as Error).message ?? String(e) };
  }
  process.send?.(reply);
});
