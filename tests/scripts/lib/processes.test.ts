import http from "node:http";
import type { AddressInfo } from "node:net";
import { describe, expect, it } from "vitest";
import { startProcess, waitForHttp } from "../../../scripts/lib/processes";

describe("startProcess", () => {
  it("stops a long-running child and its own children by process group", async () => {
    // A shell that starts a grandchild: both must go.
    const p = startProcess("sleeper", "sh", ["-c", "sleep 30 & sleep 30; wait"], { quiet: true });
    await new Promise((r) => setTimeout(r, 200));
    const pgid = p.child.pid!;
    await p.stop();
    expect(p.child.exitCode !== null || p.child.signalCode !== null).toBe(true);
    // Signals are delivered at once, but the grandchild may take a moment to be reaped.
    const groupAlive = () => {
      try {
        process.kill(-pgid, 0);
        return true;
      } catch {
        return false;
      }
    };
    for (let i = 0; i < 40 && groupAlive(); i++) await new Promise((r) => setTimeout(r, 50));
    expect(groupAlive()).toBe(false);
  });
});

describe("waitForHttp", () => {
  it("waits for a server that starts late and accepts its answer", async () => {
    const server = http.createServer((_req, res) => res.end("ok"));
    const port = await new Promise<number>((resolve) => {
      const probe = http.createServer().listen(0, "127.0.0.1", () => {
        const { port } = probe.address() as AddressInfo;
        probe.close(() => resolve(port));
      });
    });
    setTimeout(() => server.listen(port, "127.0.0.1"), 500);
    try {
      await expect(waitForHttp(`http://127.0.0.1:${port}/`, { timeoutMs: 10_000 })).resolves.toBeUndefined();
    } finally {
      server.close();
    }
  });

  it("gives up with the last error after the timeout", async () => {
    await expect(waitForHttp("http://127.0.0.1:9/", { timeoutMs: 600 })).rejects.toThrow(/did not answer within/);
  });
});
