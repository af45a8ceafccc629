import { route } from "@/lib/server/http";
import { proposeBoard, type BoardProposal } from "@/lib/server/runs";
import { boardQuerySchema, queryObject } from "@/lib/validation/runs";

export type ProposalOne = { proposal: BoardProposal };

/** ?lineId=&date=: a proposed order per shift (same cure schedule together, light to dark); nothing is saved. */
export const GET = route("/api/runs/board/propose", "GET", async ({ request }) => {
  const q = boardQuerySchema.parse(queryObject(request.url));
  return Response.json({ proposal: await proposeBoard(q.lineId, q.date) } satisfies ProposalOne);
});
