/**
 * Entry point of the child process that runs one job (forked by run-child.server.ts with tsx's
 * loader). It receives the payload over IPC, streams progress, sends the result and exits. Being a
 * separate process is what lets the worker stop it hard (time limit, cancel) even inside a long
 * Gröbner step, and a crash here cannot take the worker down.
 */
import { jobErrorText } from "~/analyses/input-problems";
import { computeJob, type JobPayload } from "./compute";

export type ChildMessage =
  | { type: "progress"; phase: string; message: string }
  | { type: "partial"; result: Record<string, unknown> }
  | { type: "result"; result: Record<string, unknown> }
  | { type: "error"; message: string; code?: string };

const send = (m: ChildMessage, done?: () => void) => process.send?.(m, undefined, {}, done ? () => done() : undefined);
const finish = (m: ChildMessage) => send(m, () => process.exit(0));

process.on("disconnect", () => process.exit(1));
process.once("message", (raw) => {
  const { payload, engineTimeoutMs } = raw as { payload: JobPayload; engineTimeoutMs: number };
  try {
    const result = computeJob(payload, {
      engineTimeoutMs,
      onProgress: (p) => {
        // The worker is gone (killed or crashed): stop computing for nobody.
        if (!process.connected) process.exit(1);
        send({ type: "progress", phase: p.phase, message: p.message });
      },
      onPartial: (result) => send({ type: "partial", result }),
    });
    finish({ type: "result", result });
  } catch (e) {
    const err = e as Error & { code?: string };
    finish({ type: "error", message: jobErrorText(e), code: typeof err.code === "string" ? err.code : undefined });
  }
});
