import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import BetterSqlite3 from "better-sqlite3";
import { afterAll, beforeAll, expect, it } from "vitest";
import { closeDatabase, getDb } from "@/db/index";
import { backupDatabase } from "@/lib/server/backup";
import { resetDatabase, teardown, useTempDatabase } from "./helpers";

const dbFile = useTempDatabase();
beforeAll(resetDatabase);
afterAll(teardown);

it("backs up while writes go on, and the restored copy opens with every committed row", async () => {
  const db = await getDb();
  const out = fs.mkdtempSync(path.join(os.tmpdir(), "coatwright-backup-"));
  // Writes interleaved with the backup: the backup sees a consistent snapshot.
  const writes = Array.from({ length: 50 }, (_, i) =>
    db.insertInto("mail_outbox").values({ from_address: "a@x.test", to_addresses: "b@x.test", subject: `m${i}`, text_body: "", received_at: i }).execute(),
  );
  const [r] = await Promise.all([backupDatabase(out), ...writes]);
  expect(r.integrity).toBe("ok");
  expect(fs.existsSync(r.file)).toBe(true);

  // Restore as documented: stop, copy over DATABASE_PATH, remove -wal/-shm, start.
  const users = await db.selectFrom("users").select("email").orderBy("email").execute();
  closeDatabase();
  for (const f of [dbFile, `${dbFile}-wal`, `${dbFile}-shm`]) fs.rmSync(f, { force: true });
  fs.copyFileSync(r.file, dbFile);
  const restored = await getDb();
  expect(await restored.selectFrom("users").select("email").orderBy("email").execute()).toEqual(users);
  const raw = new BetterSqlite3(dbFile, { readonly: true });
  expect(raw.pragma("integrity_check", { simple: true })).toBe("ok");
  raw.close();
});
