import { getDb } from "@/db/index";
import { seedDemo } from "@/db/seed/demo";
import { startMailFake } from "./mail-fake";
import { meshUnattachedDays, sweepMeshFolder } from "./meshes";
import { freezeStartedRuns } from "./runs";

/** Runs once per server process (instrumentation): migrate, seed the demo if asked, start the mail fake. */
export async function prepareServer(): Promise<void> {
  const db = await getDb();
  if (process.env.COATWRIGHT_DEMO === "1") {
    if (await seedDemo(db)) console.log("Coatwright: seeded the Bramblecote demo data.");
  }
  try {
    const frozen = await freezeStartedRuns();
    if (frozen > 0) console.log(`Coatwright: kept the plans of ${frozen} started, done or cancelled run(s) as they stand today.`);
  } catch (error) {
    // Runs without a frozen plan are planned when read, as before.
    console.error("Coatwright: run plans could not be frozen:", error instanceof Error ? error.message : error);
  }
  try {
    const swept = await sweepMeshFolder();
    const total = swept.partialFiles + swept.strayFiles + swept.unattachedMeshes;
    if (total > 0) {
      console.log(
        `Coatwright: mesh folder tidied: ${swept.partialFiles} unfinished upload(s), ${swept.strayFiles} file(s) without a record, ${swept.unattachedMeshes} mesh(es) unused by any part for ${meshUnattachedDaysText()}.`,
      );
    }
  } catch (error) {
    // Tidying is housekeeping: the app serves without it.
    console.error("Coatwright: the mesh folder could not be tidied:", error instanceof Error ? error.message : error);
  }
  if (!process.env.SMTP_URL) {
    const { port } = await startMailFake();
    console.log(`Coatwright: capturing outgoing e-mail on smtp://127.0.0.1:${port} (no SMTP_URL set).`);
  }
}

function meshUnattachedDaysText(): string {
  const days = meshUnattachedDays();
  return `${days} day${days === 1 ? "" : "s"}`;
}
