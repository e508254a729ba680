import http from "node:http";
import type { AddressInfo } from "node:net";
import { describe, expect, it } from "vitest";
import { closedLoop, makeTarget, quantile, send, summarise } from "../../../bench/lib/load-generator";

describe("quantile (nearest rank)", () => {
  it("picks the value at rank ceil(q·n)", () => {
    const v = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
    expect(quantile(v, 0.5)).toBe(5);
    expect(quantile(v, 0.95)).toBe(10);
    expect(quantile([7], 0.99)).toBe(7);
    expect(quantile([], 0.5)).toBeNaN();
  });
});

describe("summarise", () => {
  it("counts errors per route and adds an 'all' row", () => {
    const rows = summarise(
      [
        { route: "a", ms: 10, status: 200 },
        { route: "a", ms: 30, status: 500, error: "status 500" },
        { route: "b", ms: 20, status: 200 },
      ],
      2,
    );
    expect(rows.map((r) => [r.route, r.requests, r.errors, r.perSecond])).toEqual([
      ["a", 2, 1, 1],
      ["b", 1, 0, 0.5],
      ["all", 3, 1, 1.5],
    ]);
    expect(rows[0]!.reasons).toEqual(["status 500"]);
  });
});

describe("closedLoop", () => {
  it("never has more requests in flight than users, and counts unexpected statuses and timeouts as errors", async () => {
    let inFlight = 0;
    let most = 0;
    const server = http.createServer((req, res) => {
      inFlight++;
      most = Math.max(most, inFlight);
      const finish = () => {
        inFlight--;
        res.writeHead(req.url === "/missing" ? 404 : 200).end("ok");
      };
      if (req.url === "/hang") return void setTimeout(finish, 2_000);
      setTimeout(finish, 5);
    });
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
    const port = (server.address() as AddressInfo).port;
    try {
      const target = makeTarget("127.0.0.1", port, 3);
      const samples = await closedLoop(target, 3, 0.3, () => [{ route: "ok", path: "/" }]);
      expect(samples.length).toBeGreaterThan(3);
      expect(most).toBeLessThanOrEqual(3);
      expect(samples.every((s) => s.error === undefined)).toBe(true);
      expect((await send(target, { route: "m", path: "/missing" })).error).toBe("status 404");
      const quick = makeTarget("127.0.0.1", port, 1, 100);
      expect((await send(quick, { route: "h", path: "/hang" })).error).toMatch(/no answer within 100 ms/);
      target.agent.destroy();
      quick.agent.destroy();
    } finally {
      server.closeAllConnections();
      await new Promise<void>((r) => server.close(() => r()));
    }
  });
});

describe("closedLoop arrivals and browser-like retries", () => {
  it("spreads the users' first requests over one think time instead of one burst", async () => {
    const arrivals = new Map<string, number>();
    const server = http.createServer((req, res) => {
      if (!arrivals.has(req.url!)) arrivals.set(req.url!, performance.now());
      res.end("ok");
    });
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
    const port = (server.address() as AddressInfo).port;
    try {
      const target = makeTarget("127.0.0.1", port, 4);
      await closedLoop(target, 4, 0.6, (user) => [{ route: "ok", path: `/${user}`, thinkMs: 400 }]);
      expect(arrivals.size).toBe(4);
      // User 3 of 4 waits 3/4 of the think time (300 ms) before its first request: never less.
      expect(arrivals.get("/3")! - arrivals.get("/0")!).toBeGreaterThanOrEqual(290);
      target.agent.destroy();
    } finally {
      server.closeAllConnections();
      await new Promise<void>((r) => server.close(() => r()));
    }
  });

  it("sends a GET once more when a kept-alive connection is closed under it, but never a POST", async () => {
    const served = new WeakMap<object, number>();
    let requests = 0;
    const server = http.createServer((req, res) => {
      requests++;
      const n = (served.get(req.socket) ?? 0) + 1;
      served.set(req.socket, n);
      // The second request on a connection finds it closed, as when an idle connection times out.
      if (n === 2) return void req.socket.destroy();
      req.resume().on("end", () => res.end("ok"));
    });
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
    const port = (server.address() as AddressInfo).port;
    try {
      const target = makeTarget("127.0.0.1", port, 1);
      expect((await send(target, { route: "get", path: "/" })).error).toBeUndefined();
      // Second on its connection: closed under it, sent again on a fresh one, answered.
      expect((await send(target, { route: "get", path: "/" })).error).toBeUndefined();
      expect(requests).toBe(3);
      // Second on the fresh connection too, but a POST is not repeated (it may have taken effect).
      const post = await send(target, { route: "post", method: "POST", path: "/", body: "x" });
      expect(post.error).toMatch(/socket hang up|ECONNRESET/);
      expect(requests).toBe(4);
      target.agent.destroy();
    } finally {
      server.closeAllConnections();
      await new Promise<void>((r) => server.close(() => r()));
    }
  });
});
