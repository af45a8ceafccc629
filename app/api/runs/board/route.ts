import { readJson, route } from "@/lib/server/http";
import { getBoard, saveBoardOrder, type BoardView } from "@/lib/server/runs";
import { boardOrderSchema, boardQuerySchema, queryObject } from "@/lib/validation/runs";

export type BoardOne = { board: BoardView };

/** ?lineId=&date=: the line's day, shift by shift, in board order with colour changes and fill. */
export const GET = route("/api/runs/board", "GET", async ({ request }) => {
  const q = boardQuerySchema.parse(queryObject(request.url));
  return Response.json({ board: await getBoard(q.lineId, q.date) } satisfies BoardOne);
});

/** { lineId, date, shift, runIds }: saves the shift's order (sequence = position in runIds). */
export const PUT = route("/api/runs/board", "PUT", async ({ request }) => {
  const order = await readJson(request, boardOrderSchema);
  return Response.json({ board: await saveBoardOrder(order) } satisfies BoardOne);
});
