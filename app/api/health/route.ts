import { sql } from "kysely";
import { getDb } from "@/db/index";
import { publicRoute } from "@/lib/server/http";

export const GET = publicRoute("/api/health", "GET", async () => {
  const db = await getDb();
  await sql`select 1`.execute(db);
  return Response.json({ ok: true });
});
