import { getDb } from "@/db/index";
import { seedDemo } from "@/db/seed/demo";
import { startMailFake } from "./mail-fake";

/** Runs once per server process (instrumentation): migrate, seed the demo if asked, start the mail fake. */
export async function prepareServer(): Promise<void> {
  const db = await getDb();
  if (process.env.COATWRIGHT_DEMO === "1") {
    if (await seedDemo(db)) console.log("Coatwright: seeded the Bramblecote demo data.");
  }
  if (!process.env.SMTP_URL) {
    const { port } = await startMailFake();
    console.log(`Coatwright: capturing outgoing e-mail on smtp://127.0.0.1:${port} (no SMTP_URL set).`);
  }
}
