/**
 * The long-lived process in which a worker computes basis tasks (one modular image or one proof
 * batch of a distributed basis; app/jobs/task-runner.server.ts forks it). Long-lived so that a
 * run's input is parsed once per worker, not once per image; killed (SIGKILL) when a run is
 * cancelled mid-task, and forked again for the next one.
 */
import type { LiftCandidate, MultiModularInput, ProofBatch } from "@domain/algebra/f4/multimodular";
import { encodeImage, imageModPrime, proveBatch } from "@domain/algebra/f4/multimodular";
import { Limits } from "@domain/algebra/groebner/limits";

export type TaskRequest =
  | { kind: "image"; runId: string; input: MultiModularInput; prime: number; deadline: number }
  | { kind: "proof"; runId: string; input: MultiModularInput; candidate: LiftCandidate; batch: ProofBatch; deadline: number };

export type TaskReply =
  | { kind: "image"; bytes: Uint8Array; ms: number }
  | { kind: "proof"; ok: boolean; failed?: string; ms: number }
  | { kind: "error"; message: string };

// The same input object for every task of a run, so the domain's per-input cache (ring, integer
// generators, monomial table, parsed candidate) is reused. Only the latest few runs are kept.
const inputs = new Map<string, { input: MultiModularInput; candidate?: LiftCandidate }>();
function cached(runId: string, input: MultiModularInput, candidate?: LiftCandidate) {
  let c = inputs.get(runId);
  if (!c) {
    c = { input };
    inputs.set(runId, c);
    while (inputs.size > 3) inputs.delete(inputs.keys().next().value!);
  }
  if (candidate && !c.candidate) c.candidate = candidate;
  return c;
}

process.on("disconnect", () => process.exit(1));
process.on("message", (raw) => {
  const req = raw as TaskRequest;
  const t0 = Date.now();
  let reply: TaskReply;
  try {
    const limits = new Limits({ deadline: req.deadline });
    if (req.kind === "image") {
      const c = cached(req.runId, req.input);
      reply = { kind: "image", bytes: encodeImage(imageModPrime(c.input, req.prime, limits)), ms: Date.now() - t0 };
    } else {
      const c = cached(req.runId, req.input, req.candidate);
      const outcome = proveBatch(c.input, c.candidate!, req.batch, limits);
      reply = { kind: "proof", ok: outcome.ok, ...(outcome.ok ? {} : { failed: outcome.failed }), ms: Date.now() - t0 };
    }
  } catch (e) {
    reply = { kind: "error", message: (e as Error).message ?? String(e) };
  }
  process.send?.(reply);
});
