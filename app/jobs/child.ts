/**
 * Entry point of the child process that runs one job (forked by run-child.server.ts with tsx's
 * loader). It receives the payload over IPC, streams progress, sends the result and exits. Being a
 * separate process is what lets the worker stop it hard (time limit, cancel) even inside a long
 * Gröbner step, and a crash here cannot take the worker down.
 *
 * Distributed bases: given `distribution`, an analysis whose basis over Q has a slow first image
 * stops with a DistributeRequest; this process then coordinates that basis over the workers
 * (coordinator.server.ts, with its own small database pool: the lift is algebra, so it stays out
 * of the worker's event loop and dies with this process on cancel), and runs the analysis again
 * with the proven basis known. A basis that cannot be lifted or proven is computed here as before.
 */
import { jobErrorText } from "~/analyses/input-problems";
import { isDistributeRequest, type DistributionHook } from "@domain/algebra/f4/distribution";
import { computeJob, type JobPayload } from "./compute";

export type ChildMessage =
  | { type: "progress"; phase: string; message: string }
  | { type: "partial"; result: Record<string, unknown> }
  | { type: "result"; result: Record<string, unknown> }
  | { type: "error"; message: string; code?: string };

export interface ChildStart {
  payload: JobPayload;
  engineTimeoutMs: number;
  /** Set when the worker allows distributed bases for this job. */
  distribution?: { thresholdMs: number; databaseUrl: string; analysisId: string; workerId: string };
}

const send = (m: ChildMessage, done?: () => void) => process.send?.(m, undefined, {}, done ? () => done() : undefined);
const finish = (m: ChildMessage) => send(m, () => process.exit(0));

process.on("disconnect", () => process.exit(1));
process.once("message", (raw) => {
  void run(raw as ChildStart).then(finish, (e) => {
    const err = e as Error & { code?: string };
    finish({ type: "error", message: jobErrorText(e), code: typeof err.code === "string" ? err.code : undefined });
  });
});

async function run({ payload, engineTimeoutMs, distribution }: ChildStart): Promise<ChildMessage> {
  const deadline = Date.now() + engineTimeoutMs;
  const known = new Map<string, readonly string[] | null>();
  const records: Record<string, unknown>[] = [];
  const hook: DistributionHook | undefined = distribution ? { thresholdMs: distribution.thresholdMs, known } : undefined;
  for (;;) {
    try {
      const result = computeJob(payload, {
        engineTimeoutMs: Math.max(1, deadline - Date.now()),
        onProgress: (p) => {
          // The worker is gone (killed or crashed): stop computing for nobody.
          if (!process.connected) process.exit(1);
          send({ type: "progress", phase: p.phase, message: p.message });
        },
        onPartial: (result) => send({ type: "partial", result }),
        ...(hook ? { distribution: hook } : {}),
      });
      // Appended last, only when a basis was spread: every other result keeps its keys as before.
      return { type: "result", result: records.length > 0 ? { ...result, distributedBases: records } : result };
    } catch (e) {
      if (!isDistributeRequest(e) || !distribution) throw e;
      const { distributeOne } = await import("./distribute-in-child.server");
      const out = await distributeOne(e, distribution, deadline, (message) => send({ type: "progress", phase: "groebner", message }));
      known.set(out.key, out.basis);
      records.push(...out.records.map((r) => ({ ...r })));
    }
  }
}
