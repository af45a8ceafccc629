#!/usr/bin/env node
/*
 * First-load JavaScript per page route, summed from the build output (Next 16 no longer prints
 * the table): the root main files plus every entry chunk of the page's segments, gzip-compressed.
 * Also tells whether three.js is in a route's first load. Run after `npm run build`.
 */
import fs from "node:fs";
import path from "node:path";
import zlib from "node:zlib";

const NEXT = path.resolve(".next");
const THREE_SIGNATURE = "THREE.WebGLRenderer";

function walk(dir) {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    return e.isDirectory() ? walk(p) : e.name === "page_client-reference-manifest.js" ? [p] : [];
  });
}

const gzCache = new Map();
function chunkInfo(rel) {
  if (!gzCache.has(rel)) {
    const buf = fs.readFileSync(path.join(NEXT, rel));
    gzCache.set(rel, { gzip: zlib.gzipSync(buf, { level: 9 }).length, three: buf.includes(THREE_SIGNATURE) });
  }
  return gzCache.get(rel);
}

export function measureRoutes() {
  const build = JSON.parse(fs.readFileSync(path.join(NEXT, "build-manifest.json"), "utf8"));
  const root = build.rootMainFiles ?? [];
  const routes = [];
  for (const file of walk(path.join(NEXT, "server/app"))) {
    globalThis.__RSC_MANIFEST = {};
    // The manifest is a script assigning globalThis.__RSC_MANIFEST[route].
    new Function(fs.readFileSync(file, "utf8"))();
    for (const [route, m] of Object.entries(globalThis.__RSC_MANIFEST)) {
      if (route.startsWith("/_")) continue;
      const chunks = new Set(root);
      for (const list of Object.values(m.entryJSFiles ?? {})) for (const c of list) chunks.add(c);
      let gzip = 0;
      let three = false;
      for (const c of chunks) {
        const info = chunkInfo(c);
        gzip += info.gzip;
        three ||= info.three;
      }
      const url = route.replace(/\/page$/, "").replace(/\/\([^)]+\)/g, "") || "/";
      routes.push({ route: url, firstLoadGzipKb: Math.round(gzip / 102.4) / 10, three });
    }
  }
  return routes.sort((a, b) => a.route.localeCompare(b.route));
}

if (process.argv[1] && import.meta.url === `file://${process.argv[1]}`) {
  const rows = measureRoutes();
  console.log("route".padEnd(36), "first-load JS (gzip kB)", " three.js");
  for (const r of rows) console.log(r.route.padEnd(36), String(r.firstLoadGzipKb).padStart(10), "             ", r.three ? "yes" : "no");
}
