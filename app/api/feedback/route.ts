import { route } from "@/lib/server/http";
import { listEstimates } from "@/lib/server/feedback";

/** Utilisation estimates per line × coating with their history. */
export const GET = route("/api/feedback", "GET", async () => Response.json({ estimates: await listEstimates() }));
