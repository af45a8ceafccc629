import { route } from "@/lib/server/http";
import { exportPartsCsv } from "@/lib/server/parts";

/** The catalogue as CSV (the columns an import reads); ?archived=1 includes archived parts. */
export const GET = route("/api/parts/export.csv", "GET", async ({ request }) => {
  const includeArchived = new URL(request.url).searchParams.get("archived") === "1";
  const csv = await exportPartsCsv(includeArchived);
  const day = new Date().toISOString().slice(0, 10);
  return new Response(`${csv}\r\n`, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="parts-${day}.csv"`,
      "cache-control": "no-store",
    },
  });
});
