import fs from "node:fs/promises";
import path from "node:path";

// Browsers still ask for /favicon.ico on some pages even though the layout names app/icon.svg;
// answer with the same drawing instead of a 404 (which also showed as a console error).
export const dynamic = "force-static";

export async function GET(): Promise<Response> {
  const svg = await fs.readFile(path.join(process.cwd(), "app", "icon.svg"));
  return new Response(new Uint8Array(svg), {
    headers: { "content-type": "image/svg+xml", "cache-control": "public, max-age=86400" },
  });
}
