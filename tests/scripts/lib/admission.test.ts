import http from "node:http";
import type { AddressInfo } from "node:net";
import express, { type Request, type Response } from "express";
import { describe, expect, it } from "vitest";
import { admission, requestsInProgress } from "../../../scripts/lib/admission";

describe("requestsInProgress", () => {
  it("reads REQUESTS_IN_PROGRESS (default 8, 0 for no limit)", () => {
    expect(requestsInProgress(undefined)).toBe(8);
    expect(requestsInProgress(" 3 ")).toBe(3);
    expect(requestsInProgress("0")).toBe(0);
    expect(() => requestsInProgress("many")).toThrow(/REQUESTS_IN_PROGRESS must be a whole number/);
  });
});

describe("admission", () => {
  it("runs at most `limit` requests at once, the rest in arrival order, and refuses none", async () => {
    const admit = admission(2);
    const started: number[] = [];
    let most = 0;
    const held: (() => void)[] = [];
    const app = express();
    app.use(admit);
    app.use((req: Request, res: Response) => {
      const n = (req.url ?? "").slice(1);
      started.push(Number(n));
      most = Math.max(most, admit.inProgress);
      held.push(() => res.end(n));
    });
    const server = http.createServer(app);
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
    const port = (server.address() as AddressInfo).port;
    const get = (n: number) =>
      new Promise<string>((resolve, reject) => {
        http.get({ host: "127.0.0.1", port, path: `/${n}`, agent: false }, (res) => {
          let body = "";
          res.on("data", (c: Buffer) => (body += c));
          res.on("end", () => resolve(body));
        }).on("error", reject);
      });
    const until = async (check: () => boolean) => {
      while (!check()) await new Promise((r) => setTimeout(r, 5));
    };
    try {
      const answers: Promise<string>[] = [];
      for (let n = 1; n <= 5; n++) {
        answers.push(get(n));
        // Arrival order is the order the server read them in: wait until each one is in.
        await until(() => admit.inProgress + admit.waiting === n);
      }
      expect(started).toEqual([1, 2]);
      expect(admit.waiting).toBe(3);
      // Answer the oldest in progress each time: the next in line starts.
      while (held.length > 0) {
        held.shift()!();
        await new Promise((r) => setTimeout(r, 20));
      }
      await until(() => started.length === 5 && held.length === 0);
      expect(await Promise.all(answers)).toEqual(["1", "2", "3", "4", "5"]);
      expect(started).toEqual([1, 2, 3, 4, 5]);
      expect(most).toBe(2);
      expect(admit.inProgress).toBe(0);
    } finally {
      server.closeAllConnections();
      await new Promise<void>((r) => server.close(() => r()));
    }
  });

  it("does not start a waiting request whose client has gone", async () => {
    const admit = admission(1);
    const started: string[] = [];
    let release: (() => void) | undefined;
    const app = express();
    app.use(admit);
    app.use((req: Request, res: Response) => {
      started.push((req.url ?? "").slice(1));
      release = () => res.end("ok");
    });
    const server = http.createServer(app);
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
    const port = (server.address() as AddressInfo).port;
    try {
      const first = new Promise<void>((resolve) => http.get({ host: "127.0.0.1", port, path: "/first", agent: false }, (res) => res.resume().on("end", resolve)));
      while (started.length < 1) await new Promise((r) => setTimeout(r, 5));
      const impatient = http.get({ host: "127.0.0.1", port, path: "/impatient", agent: false });
      impatient.on("error", () => undefined);
      while (admit.waiting < 1) await new Promise((r) => setTimeout(r, 5));
      impatient.destroy();
      await new Promise((r) => setTimeout(r, 50));
      release!();
      await first;
      await new Promise((r) => setTimeout(r, 50));
      expect(started).toEqual(["first"]);
      expect(admit.inProgress).toBe(0);
    } finally {
      server.closeAllConnections();
      await new Promise<void>((r) => server.close(() => r()));
    }
  });
});
