import type { IncomingMessage, ServerResponse } from "node:http";
import { describe, expect, it, vi } from "vitest";
import { createTurnQueue } from "@/lib/server/turn-queue.mjs";

// The queue's contract is our own design (no outside source): at most `perTurn` requests start
// per event-loop turn, first come first served, abandoned requests are skipped, a full queue
// answers 503 and a failing handler 500 in the API's error shape.

interface FakeRes {
  statusCode: number;
  headers: Record<string, string>;
  body: string | null;
  headersSent: boolean;
  destroyed: boolean;
  setHeader(name: string, value: string): void;
  end(body: string): void;
}

function pair(id: number, destroyed = false) {
  const req = { id, destroyed } as unknown as IncomingMessage;
  const res: FakeRes = {
    statusCode: 200,
    headers: {},
    body: null,
    headersSent: false,
    destroyed: false,
    setHeader(name, value) {
      this.headers[name] = value;
    },
    end(body) {
      this.body = body;
      this.headersSent = true;
    },
  };
  return { req, res: res as unknown as ServerResponse, fake: res };
}

const nextTurn = () => new Promise<void>((resolve) => setImmediate(resolve));

describe("turn queue", () => {
  it("starts at most perTurn requests per event-loop turn, in arrival order", async () => {
    const started: number[] = [];
    const queue = createTurnQueue({ handle: (req) => void started.push((req as unknown as { id: number }).id), perTurn: 4 });
    for (let i = 0; i < 10; i++) {
      const { req, res } = pair(i);
      queue.push(req, res);
    }
    expect(started).toEqual([]);
    expect(queue.size).toBe(10);
    await nextTurn();
    expect(started).toEqual([0, 1, 2, 3]);
    await nextTurn();
    expect(started).toEqual([0, 1, 2, 3, 4, 5, 6, 7]);
    await nextTurn();
    expect(started).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8, 9]);
    expect(queue.size).toBe(0);
  });

  it("skips requests whose client went away while they waited, without using up the turn", async () => {
    const started: number[] = [];
    const queue = createTurnQueue({ handle: (req) => void started.push((req as unknown as { id: number }).id), perTurn: 2 });
    for (const [id, gone] of [[0, true], [1, false], [2, true], [3, false], [4, false]] as const) {
      const { req, res } = pair(id, gone);
      queue.push(req, res);
    }
    await nextTurn();
    expect(started).toEqual([1, 3]);
    await nextTurn();
    expect(started).toEqual([1, 3, 4]);
  });

  it("answers 503 with Retry-After once maxWaiting requests wait, and serves the rest", async () => {
    const started: number[] = [];
    const queue = createTurnQueue({ handle: (req) => void started.push((req as unknown as { id: number }).id), maxWaiting: 3 });
    const pairs = [0, 1, 2, 3].map((i) => pair(i));
    for (const p of pairs) queue.push(p.req, p.res);
    const shed = pairs[3].fake;
    expect(shed.statusCode).toBe(503);
    expect(shed.headers["retry-after"]).toBe("1");
    expect(JSON.parse(shed.body ?? "")).toEqual({ error: { code: "busy", message: expect.stringContaining("busy") } });
    await nextTurn();
    expect(started).toEqual([0, 1, 2]);
  });

  it("turns a throwing or rejecting handler into a 500 in the error shape, and goes on", async () => {
    const onError = vi.fn();
    const queue = createTurnQueue({
      handle: (req) => {
        const id = (req as unknown as { id: number }).id;
        if (id === 0) throw new Error("sync failure");
        if (id === 1) return Promise.reject(new Error("async failure"));
        return undefined;
      },
      onError,
    });
    const pairs = [0, 1, 2].map((i) => pair(i));
    for (const p of pairs) queue.push(p.req, p.res);
    await nextTurn();
    await nextTurn();
    expect(onError).toHaveBeenCalledTimes(2);
    for (const p of pairs.slice(0, 2)) {
      expect(p.fake.statusCode).toBe(500);
      const body = JSON.parse(p.fake.body ?? "");
      expect(body.error.code).toBe("internal");
      expect(body.error.message).not.toMatch(/failure/);
    }
    expect(pairs[2].fake.body).toBeNull();
  });

  it("serves every one of 5,000 waiting requests, 500 per turn", async () => {
    let count = 0;
    const queue = createTurnQueue({ handle: () => void count++, perTurn: 500 });
    for (let i = 0; i < 5000; i++) {
      const { req, res } = pair(i);
      queue.push(req, res);
    }
    for (let i = 0; i < 10; i++) await nextTurn();
    expect(count).toBe(5000);
    expect(queue.size).toBe(0);
  });
});
