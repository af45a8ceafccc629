import { readJson, route } from "@/lib/server/http";
import { ImportRefused, importParts, parsePartsCsv, readCsvUpload, type ImportResult } from "@/lib/server/parts";
import { partImportSchema } from "@/lib/validation/parts";

export type PartsImportResult = ImportResult;

/**
 * JSON `{ rows, mode }` or a multipart CSV (`file`, optional `mode`). mode "preview" (the
 * default) checks every row and writes nothing; "all" writes only when every row is valid;
 * "valid-only" writes the valid rows. `existing` "refuse" (the default) marks a row whose part
 * number is taken; "update" makes it update that part. A refused import is a 400 carrying the row report.
 */
export const POST = route("/api/parts/import", "POST", async ({ request }) => {
  try {
    if (/^multipart\/form-data\b/i.test(request.headers.get("content-type") ?? "")) {
      const { text, mode, existing } = await readCsvUpload(request);
      const { rows, problems, rowErrors } = parsePartsCsv(text);
      return Response.json((await importParts(rows, mode, problems, rowErrors, existing)) satisfies PartsImportResult);
    }
    const { rows, mode, existing } = await readJson(request, partImportSchema);
    return Response.json((await importParts(rows, mode, [], new Map(), existing)) satisfies PartsImportResult);
  } catch (e) {
    if (e instanceof ImportRefused) return e.toResponse();
    throw e;
  }
});
