#!/usr/bin/env node
/*
 * Load: drive the calculation API and a list API with 64 and 200 connections against the built
 * server (loopback only, bounded in time), next to a trivial route as the baseline.
 * `--seconds N` (default 30); npm test runs a short mode. Fails on any error, timeout or 5xx.
 */
import { spawn } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import autocannon from "autocannon";

const seconds = Number(process.argv[process.argv.indexOf("--seconds") + 1] || 0) || 30;
const dir = fs.mkdtempSync(path.join(os.tmpdir(), "coatwright-load-"));
const port = 3900 + Math.floor(Math.random() * 90);
const base = `http://127.0.0.1:${port}`;
const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

const server = spawn(process.execPath, ["server.mjs", "-H", "127.0.0.1", "-p", String(port)], {
  env: { ...process.env, COATWRIGHT_DEMO: "1", DATABASE_PATH: path.join(dir, "load.db"), SMTP_URL: "", NODE_ENV: "production" },
  stdio: "ignore",
});
for (let i = 0; i < 600; i++) {
  try {
    if ((await fetch(`${base}/api/health`)).ok) break;
  } catch {}
  await sleep(100);
}
const signIn = await fetch(`${base}/api/auth/sign-in`, {
  method: "POST",
  headers: { "content-type": "application/json" },
  body: JSON.stringify({ email: "supervisor@bramblecote.test", password: "coatwright-demo" }),
});
const cookie = signIn.headers.get("set-cookie").split(";")[0];

const targets = [
  { name: "baseline GET /api/health", path: "/api/health", method: "GET" },
  {
    name: "POST /api/calc/powder",
    path: "/api/calc/powder",
    method: "POST",
    body: JSON.stringify({ areaM2: 1.8, filmUm: 70, specificGravity: 1.5, firstPassEfficiency: 0.6, reclaimEfficiency: 0.9, parts: 400 }),
  },
  { name: "GET /api/coatings (list)", path: "/api/coatings", method: "GET" },
];

function run(t, connections, duration = seconds) {
  return new Promise((resolve, reject) => {
    const kinds = {};
    const instance = autocannon(
      {
        url: base + t.path,
        method: t.method,
        body: t.body,
        connections,
        duration,
        timeout: 20,
        headers: { cookie, "content-type": "application/json" },
      },
      (err, r) => (err ? reject(err) : resolve({ ...r, errorKinds: kinds })),
    );
    // what went wrong, by error code, so a failure can be told apart (timeout, reset, refused)
    instance.on("reqError", (e) => {
      const code = e?.code ?? e?.message ?? "unknown";
      kinds[code] = (kinds[code] ?? 0) + 1;
    });
  });
}

// Warm-up, not recorded: the first requests compile routes and warm the JIT, which would
// otherwise land on whichever row runs first (the baseline).
for (const t of targets) await run(t, 16, 2);

let failed = false;
const rows = [];
for (const connections of [64, 200]) {
  let baseline = null;
  for (const t of targets) {
    const r = await run(t, connections);
    // autocannon counts timeouts among its errors; non2xx includes the 5xx
    const bad = r.errors + r.non2xx;
    if (bad > 0) failed = true;
    baseline ??= r;
    rows.push({
      connections,
      route: t.name,
      "req/s": Math.round(r.requests.average),
      "p50 ms": r.latency.p50,
      "p99 ms": r.latency.p99,
      "max ms": r.latency.max,
      "p99 / baseline": (r.latency.p99 / Math.max(baseline.latency.p99, 1)).toFixed(2),
      "throughput / baseline": (r.requests.average / baseline.requests.average).toFixed(2),
      errors: r.errors,
      timeouts: r.timeouts,
      "error kinds": Object.entries(r.errorKinds).map(([k, n]) => `${k}×${n}`).join(" ") || "-",
      "non-2xx": r.non2xx,
    });
  }
}
server.kill("SIGTERM");
console.log(`load: ${seconds} s per row, loopback, built server`);
console.table(rows);
fs.rmSync(dir, { recursive: true, force: true });
if (failed) {
  console.error("load: errors, timeouts or non-2xx answers seen");
  process.exit(1);
}
