import { route } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { duplicateScenario } from "@/lib/server/scenarios";

/** A copy named "… (copy)", owned by whoever asked. */
export const POST = route<{ id: string }>("/api/scenarios/[id]/duplicate", "POST", async ({ params, user }) =>
  Response.json({ scenario: await duplicateScenario(parseId(params.id, "scenario"), user) }, { status: 201 }),
);
