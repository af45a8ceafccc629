/*
 * Writes lib/coating-math/unit-table.generated.ts: for each unit the app shows, its scale and
 * offset to SI and its dimension, read from mathjs's own unit definitions. The browser converts
 * with this table so mathjs stays out of client bundles; tests/unit/coating-math/unit-table.test.ts
 * checks the table against mathjs and that the file is current.
 *   npx tsx scripts/generate-unit-table.ts
 */
import fs from "node:fs";
import path from "node:path";
import { renderUnitTable } from "../lib/coating-math/unit-table-source";

const out = path.resolve("lib/coating-math/unit-table.generated.ts");
fs.writeFileSync(out, renderUnitTable());
console.log(`wrote ${out}`);
