import type { Migration, MigrationProvider } from "kysely";
import * as foundation from "./2026-12-01-foundation";
import * as coatingsLines from "./2026-12-02-coatings-lines";
import * as parts from "./2026-12-02-parts";

/**
 * Kysely's FileMigrationProvider cannot import .ts on Node 20, so migrations are listed here.
 * Names sort by date; a landed migration is never edited, only followed by a new one.
 */
const migrations: Record<string, Migration> = {
  "2026-12-01-foundation": foundation,
  "2026-12-02-coatings-lines": coatingsLines,
  "2026-12-02-parts": parts,
};

export const migrationProvider: MigrationProvider = {
  async getMigrations() {
    return migrations;
  },
};
