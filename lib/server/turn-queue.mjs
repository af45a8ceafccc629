/*
 * Starts waiting HTTP requests a few at a time, one batch per event-loop turn.
 *
 * Why: on Node 20 (libuv 1.46) a listening socket accepts one new connection per turn of the
 * event loop. When every open connection has a request ready, one turn runs all of them, so a
 * burst of new connections on a busy server was accepted at a handful per second and some
 * waited 20 s in the kernel's queue (found with `ss`: the listening socket's Recv-Q held ~110
 * connections and drained by ~6 per second). Starting at most `perTurn` requests per turn keeps
 * each turn short, so new connections are taken in promptly. Plain JavaScript because
 * server.mjs runs without a build step.
 */

/**
 * @param {{
 *   handle: (req: import("node:http").IncomingMessage, res: import("node:http").ServerResponse) => unknown,
 *   perTurn?: number,
 *   maxWaiting?: number,
 *   onError?: (error: unknown) => void,
 * }} options
 */
export function createTurnQueue({ handle, perTurn = 4, maxWaiting = 5000, onError = (e) => console.error(e) }) {
  /** @type {Array<[import("node:http").IncomingMessage, import("node:http").ServerResponse] | undefined>} */
  let waiting = [];
  let head = 0;
  let scheduled = false;

  function start(req, res) {
    try {
      Promise.resolve(handle(req, res)).catch((error) => fail(res, error));
    } catch (error) {
      fail(res, error);
    }
  }

  function fail(res, error) {
    onError(error);
    if (!res.headersSent && !res.destroyed) {
      res.statusCode = 500;
      res.setHeader("content-type", "application/json");
      res.end(JSON.stringify({ error: { code: "internal", message: "The server could not answer this request." } }));
    }
  }

  function turn() {
    scheduled = false;
    let started = 0;
    while (started < perTurn && head < waiting.length) {
      const item = waiting[head];
      waiting[head++] = undefined;
      if (!item) continue;
      const [req, res] = item;
      // the client gave up while it waited: nothing to answer
      if (req.destroyed || res.destroyed) continue;
      started++;
      start(req, res);
    }
    if (head > 1024 && head * 2 > waiting.length) {
      waiting = waiting.slice(head);
      head = 0;
    }
    if (head < waiting.length) schedule();
  }

  function schedule() {
    if (scheduled) return;
    scheduled = true;
    // an immediate queued during the check phase runs in the next turn, after the poll phase
    setImmediate(turn);
  }

  return {
    /** Queue a request; answers 503 at once when `maxWaiting` requests already wait. */
    push(req, res) {
      if (waiting.length - head >= maxWaiting) {
        res.statusCode = 503;
        res.setHeader("retry-after", "1");
        res.setHeader("content-type", "application/json");
        res.end(JSON.stringify({ error: { code: "busy", message: "The server is busy. Try again in a moment." } }));
        return;
      }
      waiting.push([req, res]);
      schedule();
    },
    /** Requests waiting to start. */
    get size() {
      return waiting.length - head;
    },
  };
}
