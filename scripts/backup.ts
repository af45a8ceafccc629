/*
 * npm run backup [-- --out DIR]: an online backup of the SQLite database while the app runs,
 * through SQLite's backup API (better-sqlite3 db.backup), to DIR/coatwright-YYYYMMDD-HHMMSS.db.
 * Restore: stop the app, copy the backup over DATABASE_PATH (removing any -wal/-shm beside it), start.
 */
import path from "node:path";
import { backupDatabase } from "../lib/server/backup";
import { closeDatabase, databasePath } from "../db/index";

function arg(name: string): string | undefined {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? process.argv[i + 1] : undefined;
}

const outDir = path.resolve(arg("out") ?? path.join(path.dirname(databasePath()), "backups"));
backupDatabase(outDir)
  .then((r) => {
    console.log(`Backed up ${databasePath()} to ${r.file} (${r.pages} pages, integrity ${r.integrity}).`);
    closeDatabase();
  })
  .catch((e) => {
    console.error(e instanceof Error ? e.message : e);
    process.exit(1);
  });
