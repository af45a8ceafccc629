import type { Role } from "@/db/schema";

export const ROLES: readonly Role[] = ["admin", "manager", "supervisor", "engineer", "purchaser", "operator"];
export type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";

/** "public": no session needed; "signed-in": any role; otherwise the roles allowed (admin always is). */
export type Access = "public" | "signed-in" | readonly Role[];

const ANY: Access = "signed-in";

/*
 * The one declared access table. Every route handler under app/api and every server action
 * has its row here; tests/api/access-table.test.ts walks the files and fails on anything missing,
 * and drives every row anonymously and with each role.
 */
export const apiAccess: Record<string, Partial<Record<Method, Access>>> = {
  "/api/health": { GET: "public" },
  "/api/auth/sign-in": { POST: "public" },
  "/api/auth/sign-out": { POST: "public" },
  "/api/auth/accept-invite": { POST: "public" },
  "/api/auth/request-reset": { POST: "public" },
  "/api/auth/reset-password": { POST: "public" },
  "/api/me": { GET: ANY, PATCH: ANY },
  "/api/admin/users": { GET: ["admin"], POST: ["admin"] },
  "/api/admin/users/[id]": { PATCH: ["admin"] },
  "/api/admin/outbox": { GET: ["admin"] },
  "/api/admin/settings": { GET: ANY, PUT: ["admin"] },
  // Planning is read-only arithmetic on the numbers sent: any signed-in role may ask.
  "/api/rack/plan": { POST: ANY },
  // Saved racking plans: engineers and supervisors (and admin) save them; every role reads them
  // (operators print the plan for the line).
  "/api/rack/plans": { GET: ANY, POST: ["engineer", "supervisor"] },
  "/api/rack/plans/[id]": { GET: ANY, PUT: ["engineer", "supervisor"], DELETE: ["engineer", "supervisor"] },
  "/api/calc/powder": { POST: ANY },
  "/api/calc/ecoat": { POST: ANY },
  "/api/calc/line": { POST: ANY },
  "/api/calc/cure": { POST: ANY },
  "/api/calc/film": { POST: ANY },
  "/api/openapi.json": { GET: ANY },
  "/api/coatings": { GET: ANY, POST: ["purchaser"] },
  "/api/coatings/[id]": { GET: ANY, PUT: ["purchaser"], DELETE: ["purchaser"] },
  "/api/coatings/[id]/lots": { POST: ["purchaser"] },
  "/api/lines": { GET: ANY, POST: ["manager"] },
  "/api/lines/[id]": { GET: ANY, PUT: ["manager"], DELETE: ["manager"] },
  "/api/lines/[id]/timeline": { GET: ANY },
  "/api/lines/[id]/cure-check": { POST: ANY },
  // Parts: engineers (and admin) create and edit; everyone reads. Uploads stream to the data folder.
  "/api/parts": { GET: ANY, POST: ["engineer"] },
  "/api/parts/[id]": { GET: ANY, PUT: ["engineer"], DELETE: ["engineer"] },
  "/api/parts/measure": { POST: ["engineer"] },
  "/api/parts/export.csv": { GET: ANY },
  "/api/parts/import": { POST: ["engineer"] },
  "/api/meshes": { POST: ["engineer"] },
  "/api/meshes/[id]": { GET: ANY, PATCH: ["engineer"] },
  "/api/meshes/[id]/file": { GET: ANY },
  // Scenarios: managers (and admin) save what-ifs; everyone signed in reads and compares.
  "/api/scenarios": { GET: ANY, POST: ["manager"] },
  "/api/scenarios/[id]": { GET: ANY, PUT: ["manager"], DELETE: ["manager"] },
  "/api/scenarios/[id]/duplicate": { POST: ["manager"] },
  "/api/throughput/compare": { POST: ANY },
  // Runs: supervisors (and admin) plan and move them; every signed-in role reads plans and run sheets.
  "/api/runs": { GET: ANY, POST: ["supervisor"] },
  "/api/runs/preview": { POST: ANY },
  "/api/runs/[id]": { GET: ANY, PUT: ["supervisor"], DELETE: ["supervisor"] },
  "/api/runs/[id]/status": { POST: ["supervisor"] },
  "/api/runs/board": { GET: ANY, PUT: ["supervisor"] },
  "/api/runs/board/propose": { GET: ANY },
  // Film checks: operators and supervisors (and admin) record readings and tests; everyone reads.
  "/api/runs/[id]/film-checks": { GET: ANY, POST: ["operator", "supervisor"] },
  "/api/film-checks/[id]": { GET: ANY, PUT: ["operator", "supervisor"], DELETE: ["operator", "supervisor"] },
  "/api/runs/[id]/tests": { GET: ANY, POST: ["operator", "supervisor"] },
  "/api/gauges": { GET: ANY, POST: ["operator", "supervisor"] },
  // Gauges: whoever records readings keeps the gauge list (verification dates, mapping, retiring).
  "/api/gauges/[id]": { GET: ANY, PUT: ["operator", "supervisor"], DELETE: ["operator", "supervisor"] },
  "/api/quality/trend": { GET: ["supervisor", "manager"] },
  // Oven profiles: supervisors and engineers (and admin) import and delete; managers read them and,
  // as they own the lines, may also store a fitted heat-transfer coefficient on an oven.
  "/api/profiles": { GET: ["supervisor", "engineer", "manager"], POST: ["supervisor", "engineer"] },
  "/api/profiles/preview": { POST: ["supervisor", "engineer"] },
  "/api/profiles/[id]": { GET: ["supervisor", "engineer", "manager"], DELETE: ["supervisor", "engineer"] },
  "/api/profiles/[id]/apply-fit": { POST: ["supervisor", "engineer", "manager"] },
  "/api/loggers": { GET: ["supervisor", "engineer", "manager"], POST: ["supervisor", "engineer"] },
  // Forecast and purchasing: purchasers (and admin) order and receive; managers read the forecast.
  "/api/forecast": { GET: ["purchaser", "manager"] },
  "/api/forecast.csv": { GET: ["purchaser", "manager"] },
  "/api/purchase-requests": { GET: ["purchaser", "manager"], POST: ["purchaser"] },
  "/api/purchase-requests/[id]": { GET: ["purchaser", "manager"], PATCH: ["purchaser"] },
  "/api/purchase-requests/[id]/receive": { POST: ["purchaser"] },
  // Actual use: operators and supervisors record it on a done run; the estimates are for supervisors and managers.
  "/api/runs/[id]/actual-use": { GET: ANY, POST: ["operator", "supervisor"] },
  "/api/feedback": { GET: ["supervisor", "manager", "purchaser"] },
  "/api/feedback/[id]": { PATCH: ["supervisor"] },
  "/api/feedback/reset": { POST: ["supervisor"] },
};

export const actionAccess: Record<string, Access> = {
  "app/(app)/settings/actions.ts#saveUnitSystem": ANY,
};

export function allows(access: Access, role: Role | null): boolean {
  if (access === "public") return true;
  if (role === null) return false;
  if (access === "signed-in" || role === "admin") return true;
  return access.includes(role);
}
