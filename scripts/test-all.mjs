#!/usr/bin/env node
/*
 * npm test: unit + API tests, a production build (checked to create no database file),
 * then the browser tests against the built app in Debian's Chromium, then short runs of the
 * durability (5 SIGKILLs) and load (5 s per row) scripts.
 * Prints one closing line "N passed, N failed" over all of them.
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";

const chromium = process.env.CHROMIUM_PATH || "/usr/bin/chromium";
const out = fs.mkdtempSync(path.join(os.tmpdir(), "coatwright-test-"));
let passed = 0;
let failed = 0;
let skipped = 0;

function run(label, cmd, args, env = {}) {
  console.log(`\n== ${label}: ${cmd} ${args.join(" ")}`);
  const r = spawnSync(cmd, args, { stdio: "inherit", env: { ...process.env, ...env } });
  return r.status === 0;
}

function count(jsonFile) {
  if (!fs.existsSync(jsonFile)) return;
  const j = JSON.parse(fs.readFileSync(jsonFile, "utf8"));
  passed += j.numPassedTests ?? 0;
  failed += j.numFailedTests ?? 0;
  skipped += (j.numPendingTests ?? 0) + (j.numTodoTests ?? 0);
}

function vitest(label, projects) {
  const json = path.join(out, `${label}.json`);
  const ok = run(label, "node_modules/.bin/vitest", [
    "run",
    ...projects.flatMap((p) => ["--project", p]),
    "--reporter=default",
    "--reporter=json",
    `--outputFile.json=${json}`,
  ]);
  count(json);
  return ok;
}

function finish(code) {
  console.log(`\n${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ""}`);
  process.exit(code);
}

if (!fs.existsSync(chromium)) {
  console.error(
    `Chromium was not found at ${chromium}. The browser tests need Debian's package:\n` +
      `  sudo apt-get install -y chromium\n(or set CHROMIUM_PATH to another Chromium binary).`,
  );
  process.exit(1);
}

let ok = vitest("unit-and-api", ["unit", "api"]);

// The build must not create a database: point DATABASE_PATH somewhere fresh and check it stays absent.
const buildDb = path.join(out, "must-not-exist.db");
const built = run("build", "node_modules/.bin/next", ["build"], { DATABASE_PATH: buildDb });
if (!built) finish(1);
if (fs.existsSync(buildDb)) {
  console.error("FAIL: next build created a database file.");
  failed += 1;
  ok = false;
} else {
  console.log("build created no database file: ok");
  passed += 1;
}

ok = vitest("browser", ["e2e"]) && ok;

// Short modes of the durability and load scripts (their full runs: npm run durability / npm run load).
for (const [label, script, args] of [
  ["durability (short)", "scripts/durability.mjs", ["--kills", "5"]],
  ["load (short)", "scripts/load.mjs", ["--seconds", "5"]],
]) {
  if (run(label, "node", [script, ...args])) passed += 1;
  else {
    failed += 1;
    ok = false;
  }
}
finish(ok && failed === 0 ? 0 : 1);
