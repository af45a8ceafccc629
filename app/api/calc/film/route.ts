import { evaluateFilm } from "@/lib/coating-math/film";
import { readJson, route } from "@/lib/server/http";
import { checkedResult, filmInputSchema, filmResultSchema, resultBlame, type FilmResultBody } from "@/lib/validation/calc";

export type FilmResult = FilmResultBody;

// Dry film acceptance by SSPC-PA 2 (spots and areas) or ISO 19840 (the 80–20 rule).
export const POST = route("/api/calc/film", "POST", async ({ request }) => {
  const input = await readJson(request, filmInputSchema);
  const result: FilmResult = checkedResult(filmResultSchema, evaluateFilm(input), resultBlame.film);
  return Response.json(result);
});
