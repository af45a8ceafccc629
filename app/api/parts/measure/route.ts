import { readJson, route } from "@/lib/server/http";
import { measurePart, type PartMeasure } from "@/lib/server/parts";
import { partMeasureSchema } from "@/lib/validation/parts";

export type PartMeasureResult = PartMeasure;

/** What a part's inputs work out to (area, box, mass), without saving: the form's live figures. */
export const POST = route("/api/parts/measure", "POST", async ({ request }) => {
  const input = await readJson(request, partMeasureSchema);
  return Response.json((await measurePart(input)) satisfies PartMeasureResult);
});
