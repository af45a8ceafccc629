import { readJson, route } from "@/lib/server/http";
import { listLoggers, saveLogger, type LoggerView } from "@/lib/server/profiles";
import { loggerSchema } from "@/lib/validation/profiles";

export type LoggersList = { loggers: LoggerView[] };
export type LoggerSaved = { logger: LoggerView };

export const GET = route("/api/loggers", "GET", async () => Response.json({ loggers: await listLoggers() } satisfies LoggersList));

/** Remembers a column mapping under a logger's name or serial: 201 for a new logger, 200 when its mapping is replaced. */
export const POST = route("/api/loggers", "POST", async ({ request }) => {
  const body = await readJson(request, loggerSchema);
  const { logger, created } = await saveLogger(body);
  return Response.json({ logger } satisfies LoggerSaved, { status: created ? 201 : 200 });
});
