#!/usr/bin/env node
/*
 * Durability: start the built server on a temporary database, drive writes while killing it with
 * SIGKILL at random moments, restart, and check that SQLite's integrity_check passes and every
 * write acknowledged with a 2xx (runs created, film readings recorded) is present. `--kills N` (default 50); npm test runs a short mode.
 * Loopback only; bounded in count and time.
 */
import { spawn } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import Database from "better-sqlite3";

const kills = Number(process.argv[process.argv.indexOf("--kills") + 1] || 0) || 50;
const dir = fs.mkdtempSync(path.join(os.tmpdir(), "coatwright-durability-"));
const dbFile = path.join(dir, "durability.db");
const port = 3700 + Math.floor(Math.random() * 200);
const base = `http://127.0.0.1:${port}`;
const rand = (a, b) => a + Math.random() * (b - a);
const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

function start() {
  const child = spawn(process.execPath, ["server.mjs", "-H", "127.0.0.1", "-p", String(port)], {
    env: { ...process.env, COATWRIGHT_DEMO: "1", DATABASE_PATH: dbFile, SMTP_URL: "", NODE_ENV: "production" },
    stdio: "ignore",
  });
  return child;
}

async function waitUp(ms = 60_000) {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) return;
    } catch {}
    await sleep(100);
  }
  throw new Error("server did not come up");
}

async function signIn() {
  const r = await fetch(`${base}/api/auth/sign-in`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ email: "supervisor@bramblecote.test", password: "coatwright-demo" }),
  });
  if (!r.ok) throw new Error(`sign-in ${r.status}`);
  return r.headers.get("set-cookie").split(";")[0];
}

const json = (cookie, body) => ({
  method: body === undefined ? "GET" : "POST",
  headers: { "content-type": "application/json", cookie },
  body: body === undefined ? undefined : JSON.stringify(body),
});

/** Demo part, line and coatings for the runs the loops create (read once, after the first start). */
async function runTemplate(cookie) {
  const get = async (p) => (await fetch(`${base}${p}`, json(cookie))).json();
  const { parts } = await get("/api/parts");
  const { lines } = await get("/api/lines");
  const { coatings } = await get("/api/coatings");
  const part = parts.find((p) => p.number === "BC-2210") ?? parts[0];
  const line = lines.find((l) => l.kind === "conveyor") ?? lines[0];
  const ecoat = coatings.find((c) => c.code === "EC-200") ?? coatings[0];
  return {
    partId: part.id,
    quantity: 40,
    lineId: line.id,
    date: new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10),
    shift: 2,
    clearanceMm: 50,
    orientations: "any",
    coats: [{ coatingId: ecoat.id, filmUm: 20 }],
    masking: "",
    notes: "durability probe",
  };
}

/**
 * Writes until the server dies: each turn creates a run, starts it, then records film readings on it.
 * Every write answered 201 is remembered by the id in its answer; afterwards each must be there.
 */
async function writeLoop(cookie, template, acked, stop) {
  while (!stop.done) {
    try {
      const r = await fetch(`${base}/api/runs`, json(cookie, template));
      if (r.status >= 500) throw new Error(`5xx ${r.status} on POST /api/runs`);
      if (r.status !== 201) throw new Error(`unexpected ${r.status} on POST /api/runs: ${await r.text()}`);
      const runId = (await r.json()).run.id;
      acked.runs.push(runId);
      // readings are taken once the run has started
      for (const status of ["planned", "in-progress"]) {
        const m = await fetch(`${base}/api/runs/${runId}/status`, json(cookie, { status }));
        if (m.status >= 500) throw new Error(`5xx ${m.status} on POST status`);
        if (m.status !== 200) throw new Error(`unexpected ${m.status} on POST status ${status}: ${await m.text()}`);
      }
      const f = await fetch(
        `${base}/api/runs/${runId}/film-checks`,
        json(cookie, { rule: "sspc-pa2", coatIndex: 0, areas: [[[20, 21, 19], [22, 20, 21], [19, 20, 20]]] }),
      );
      if (f.status >= 500) throw new Error(`5xx ${f.status} on POST film-checks`);
      if (f.status !== 201) throw new Error(`unexpected ${f.status} on POST film-checks: ${await f.text()}`);
      acked.checks.push((await f.json()).check.id);
    } catch (e) {
      if (/5xx|unexpected/.test(String(e))) throw e;
      return; // connection refused or reset, or a cut-off body: the server was killed
    }
  }
}

// A bound on the whole script, which also keeps the event loop alive: a wait that can never end
// fails loudly here instead of Node quietly exiting with code 13.
const limitS = kills * 40 + 180;
const guard = setTimeout(() => {
  console.error(`durability: gave up after ${limitS} s`);
  process.exit(1);
}, limitS * 1000);

const acked = { runs: [], checks: [] };
const failures = [];
let template = null;
const t0 = Date.now();
for (let k = 0; k < kills; k++) {
  const child = start();
  await waitUp();
  const cookie = await signIn();
  template ??= await runTemplate(cookie);
  const stop = { done: false };
  const loops = [0, 1, 2].map(() => writeLoop(cookie, template, acked, stop).catch((e) => failures.push(String(e))));
  await sleep(rand(100, 1500));
  child.kill("SIGKILL");
  stop.done = true;
  await Promise.all(loops);
  await new Promise((r) => (child.exitCode !== null || child.signalCode !== null ? r() : child.once("exit", r)));
}

// Restart once more so the app opens (and migrates) the database after the last kill.
const last = start();
await waitUp();
last.kill("SIGTERM");
await new Promise((r) => (last.exitCode !== null || last.signalCode !== null ? r() : last.once("exit", r)));

const db = new Database(dbFile, { readonly: true });
const integrity = db.pragma("integrity_check", { simple: true });
const have = (table, ids) => {
  const present = new Set(db.prepare(`select id from ${table} where id in (${ids.map(() => "?").join(",") || "null"})`).pluck().all(...ids));
  return ids.filter((id) => !present.has(id));
};
const missingRuns = have("runs", acked.runs);
const missingChecks = have("film_checks", acked.checks);
db.close();
const seconds = ((Date.now() - t0) / 1000).toFixed(1);
console.log(
  `durability: ${kills} SIGKILLs in ${seconds} s; acknowledged ${acked.runs.length} runs and ${acked.checks.length} film checks; ` +
    `missing ${missingRuns.length} runs, ${missingChecks.length} film checks; integrity_check=${integrity}; failed answers ${failures.length}`,
);
for (const f of failures.slice(0, 5)) console.log(`  ${f}`);
fs.rmSync(dir, { recursive: true, force: true });
clearTimeout(guard);
if (integrity !== "ok" || missingRuns.length + missingChecks.length > 0 || failures.length > 0 || acked.runs.length === 0) process.exit(1);
