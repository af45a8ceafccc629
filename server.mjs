#!/usr/bin/env node
/*
 * Production server: Next's request handler behind Node's http server, with requests started a
 * few per event-loop turn (lib/server/turn-queue.mjs explains why). `npm start`, `npm run demo`,
 * the browser tests and the load and durability scripts all run this.
 *   node server.mjs [-H 127.0.0.1] [-p 3000]     (or PORT in the environment)
 */
import http from "node:http";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { createTurnQueue } from "./lib/server/turn-queue.mjs";

function option(short, long, fallback) {
  const args = process.argv.slice(2);
  const i = args.findIndex((a) => a === short || a === long);
  return i >= 0 && args[i + 1] ? args[i + 1] : fallback;
}

const hostname = option("-H", "--hostname", "127.0.0.1");
const port = Number(option("-p", "--port", process.env.PORT || "3000"));
if (!Number.isInteger(port) || port < 0 || port > 65535) {
  console.error(`Coatwright: port must be a whole number from 0 to 65535, got "${option("-p", "--port", process.env.PORT)}"`);
  process.exit(2);
}
process.env.NODE_ENV ??= "production";

const { default: next } = await import("next");
const app = next({ dev: false, dir: path.dirname(fileURLToPath(import.meta.url)), hostname, port });
await app.prepare();
const handle = app.getRequestHandler();
const queue = createTurnQueue({ handle: (req, res) => handle(req, res) });

const server = http.createServer((req, res) => queue.push(req, res));
server.listen(port, hostname, () => {
  console.log(`Coatwright: listening on http://${hostname}:${server.address().port}`);
});

function stop(signal) {
  console.log(`Coatwright: ${signal}, closing`);
  server.close(() => process.exit(0));
  server.closeIdleConnections();
  // answers in flight get a few seconds, then the process ends anyway
  setTimeout(() => process.exit(0), 5000).unref();
}
process.once("SIGTERM", () => stop("SIGTERM"));
process.once("SIGINT", () => stop("SIGINT"));
