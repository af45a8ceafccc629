/** Types of lib/server/turn-queue.mjs. */
import type { IncomingMessage, ServerResponse } from "node:http";

export interface TurnQueue {
  /** Queue a request; answers 503 at once when `maxWaiting` requests already wait. */
  push(req: IncomingMessage, res: ServerResponse): void;
  /** Requests waiting to start. */
  readonly size: number;
}

export function createTurnQueue(options: {
  handle: (req: IncomingMessage, res: ServerResponse) => unknown;
  /** requests started per event-loop turn, default 4 */
  perTurn?: number;
  /** waiting requests before new ones get 503, default 5000 */
  maxWaiting?: number;
  onError?: (error: unknown) => void;
}): TurnQueue;
