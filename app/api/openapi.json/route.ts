import { route } from "@/lib/server/http";
import { openApiDocument } from "@/lib/server/openapi";

// Signed-in only, like the routes it describes.
export const GET = route("/api/openapi.json", "GET", async () => Response.json(openApiDocument()));
