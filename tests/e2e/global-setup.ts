import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import type { TestProject } from "vitest/node";

/*
 * Starts the built app (npm run build first) on a throwaway database with the demo data,
 * on a free loopback port, and hands the address to the browser tests.
 */
let server: ChildProcess | null = null;

async function waitFor(url: string, ms: number): Promise<void> {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    try {
      const r = await fetch(url);
      if (r.ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`server did not answer ${url} within ${ms} ms`);
}

export async function setup(project: TestProject) {
  if (!fs.existsSync(".next/BUILD_ID")) throw new Error("Build the app first: npm run build");
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "coatwright-e2e-"));
  const port = 3200 + Math.floor(Math.random() * 500);
  const base = `http://127.0.0.1:${port}`;
  server = spawn(process.execPath, ["server.mjs", "-H", "127.0.0.1", "-p", String(port)], {
    env: { ...process.env, COATWRIGHT_DEMO: "1", DATABASE_PATH: path.join(dir, "e2e.db"), APP_URL: base, SMTP_URL: "", NODE_ENV: "production" },
    stdio: ["ignore", "pipe", "pipe"],
  });
  const log = fs.createWriteStream(path.join(dir, "server.log"));
  server.stdout?.pipe(log);
  server.stderr?.pipe(log);
  await waitFor(`${base}/api/health`, 60_000);
  project.provide("baseUrl", base);
  project.provide("dataDir", dir);
}

export async function teardown() {
  server?.kill("SIGTERM");
}

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    dataDir: string;
  }
}
