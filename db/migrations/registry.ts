import type { Migration, MigrationProvider } from "kysely";
import * as foundation from "./2026-12-01-foundation";
import * as coatingsLines from "./2026-12-02-coatings-lines";
import * as parts from "./2026-12-02-parts";
import * as partsExtra from "./2026-12-02-parts-extra";
import * as scenarios from "./2026-12-02-scenarios";
import * as runs from "./2026-12-02-runs";
import * as profiles from "./2026-12-02-profiles";
import * as filmChecks from "./2026-12-02-film-checks";
import * as gaugeUpkeep from "./2026-12-03-gauge-upkeep";
import * as purchasing from "./2026-12-02-purchasing";
import * as rackPlans from "./2026-12-03-rack-plans";
import * as frozenRunPlans from "./2026-12-04-frozen-run-plans";

/**
 * Kysely's FileMigrationProvider cannot import .ts on Node 20, so migrations are listed here.
 * Names sort by date; a landed migration is never edited, only followed by a new one.
 */
const migrations: Record<string, Migration> = {
  "2026-12-01-foundation": foundation,
  "2026-12-02-coatings-lines": coatingsLines,
  "2026-12-02-parts": parts,
  "2026-12-02-parts-extra": partsExtra,
  "2026-12-02-scenarios": scenarios,
  "2026-12-02-runs": runs,
  "2026-12-02-profiles": profiles,
  "2026-12-02-film-checks": filmChecks,
  "2026-12-03-gauge-upkeep": gaugeUpkeep,
  "2026-12-02-purchasing": purchasing,
  "2026-12-03-rack-plans": rackPlans,
  "2026-12-04-frozen-run-plans": frozenRunPlans,
};

export const migrationProvider: MigrationProvider = {
  async getMigrations() {
    return migrations;
  },
};
