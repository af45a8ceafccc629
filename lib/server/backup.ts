import fs from "node:fs";
import path from "node:path";
import BetterSqlite3 from "better-sqlite3";
import { getSqlite } from "@/db/index";

function stamp(d = new Date()): string {
  const p = (n: number) => String(n).padStart(2, "0");
  return `${d.getUTCFullYear()}${p(d.getUTCMonth() + 1)}${p(d.getUTCDate())}-${p(d.getUTCHours())}${p(d.getUTCMinutes())}${p(d.getUTCSeconds())}`;
}

/** SQLite's online backup: safe while the app keeps writing; the copy is checked before it is reported. */
export async function backupDatabase(outDir: string): Promise<{ file: string; pages: number; integrity: string }> {
  fs.mkdirSync(outDir, { recursive: true });
  let file = path.join(outDir, `coatwright-${stamp()}.db`);
  for (let i = 1; fs.existsSync(file); i++) file = path.join(outDir, `coatwright-${stamp()}-${i}.db`);
  const sqlite = await getSqlite();
  const r = await sqlite.backup(file);
  const copy = new BetterSqlite3(file, { readonly: true });
  const integrity = String(copy.pragma("integrity_check", { simple: true }));
  copy.close();
  return { file, pages: r.totalPages, integrity };
}
