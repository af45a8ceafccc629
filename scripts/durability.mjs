#!/usr/bin/env node
/*
 * Durability: start the built server on a temporary database, drive writes while killing it with
 * SIGKILL at random moments, restart, and check that SQLite's integrity_check passes and every
 * write acknowledged with a 2xx is present. `--kills N` (default 50); npm test runs a short mode.
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
  const child = spawn("node_modules/.bin/next", ["start", "-H", "127.0.0.1", "-p", String(port)], {
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
    body: JSON.stringify({ email: "admin@bramblecote.test", password: "coatwright-demo" }),
  });
  if (!r.ok) throw new Error(`sign-in ${r.status}`);
  return r.headers.get("set-cookie").split(";")[0];
}

/** One acknowledged write = one invited user; the e-mail is the key we look for afterwards. */
async function writeLoop(cookie, acked, stop) {
  let i = 0;
  while (!stop.done) {
    const email = `dur-${process.pid}-${Date.now()}-${i++}@bramblecote.test`;
    try {
      const r = await fetch(`${base}/api/admin/users`, {
        method: "POST",
        headers: { "content-type": "application/json", cookie },
        body: JSON.stringify({ email, name: "Durability Probe", role: "operator" }),
      });
      if (r.status === 201) acked.push(email);
      else if (r.status >= 500) throw new Error(`5xx ${r.status}`);
    } catch (e) {
      if (String(e).includes("5xx")) throw e;
      return; // connection refused or reset: the server was killed
    }
  }
}

const acked = [];
let fivexx = 0;
const t0 = Date.now();
for (let k = 0; k < kills; k++) {
  const child = start();
  await waitUp();
  const cookie = await signIn();
  const stop = { done: false };
  const loops = [0, 1, 2].map(() => writeLoop(cookie, acked, stop).catch(() => fivexx++));
  await sleep(rand(50, 600));
  child.kill("SIGKILL");
  stop.done = true;
  await Promise.all(loops);
  await new Promise((r) => (child.exitCode !== null ? r() : child.once("exit", r)));
}

// Restart once more so the app opens (and migrates) the database after the last kill.
const last = start();
await waitUp();
last.kill("SIGTERM");
await sleep(500);

const db = new Database(dbFile, { readonly: true });
const integrity = db.pragma("integrity_check", { simple: true });
const present = new Set(db.prepare("select email from users where email like 'dur-%'").all().map((r) => r.email));
const missing = acked.filter((e) => !present.has(e));
db.close();
const seconds = ((Date.now() - t0) / 1000).toFixed(1);
console.log(`durability: ${kills} SIGKILLs in ${seconds} s, ${acked.length} acknowledged writes, ${missing.length} missing, integrity_check=${integrity}, 5xx=${fivexx}`);
fs.rmSync(dir, { recursive: true, force: true });
if (integrity !== "ok" || missing.length > 0 || fivexx > 0) process.exit(1);
