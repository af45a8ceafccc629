import { route, readJson } from "@/lib/server/http";
import { plantSettings, updatePlantSettings } from "@/lib/server/plant";
import { plantSettingsSchema } from "@/lib/validation/auth";

export const GET = route("/api/admin/settings", "GET", async () => Response.json({ settings: await plantSettings() }));

export const PUT = route("/api/admin/settings", "PUT", async ({ request }) => {
  const input = await readJson(request, plantSettingsSchema);
  return Response.json({ settings: await updatePlantSettings(input) });
});
