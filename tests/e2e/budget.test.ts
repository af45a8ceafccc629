import { beforeAll, describe, expect, it } from "vitest";
import { measureRoutes, type RouteFirstLoad } from "../../scripts/bundle-budget.mjs";

/*
 * Performance budget, read from the production build (the e2e project runs after `next build`):
 * every page's first-load JavaScript (gzip) stays at or under 150 kB, and three.js is in no
 * page's first load (the 3D views load on demand). Code a page loads later — a form opened with a
 * button, a chart or 3D view after hydration — does not count; see DEVELOPERS.md.
 */
const BUDGET_KB = 150;
const routes: RouteFirstLoad[] = measureRoutes();

beforeAll(() => {
  const rows = routes.map((r) => `${r.route.padEnd(28)} ${r.firstLoadGzipKb.toFixed(1).padStart(6)} kB${r.three ? "  three.js" : ""}`);
  console.log(`First-load JavaScript per page (gzip; budget ${BUDGET_KB} kB)\n${rows.join("\n")}`);
});

describe("first-load JavaScript budget", () => {
  it("found the pages in the build", () => {
    const names = routes.map((r) => r.route);
    for (const page of ["/", "/sign-in", "/calculators", "/parts", "/parts/[id]", "/coatings", "/racking"]) expect(names).toContain(page);
  });

  it.each(routes.map((r) => [r.route, r] as const))("%s", (_route, r) => {
    expect(r.three, "three.js must load only on demand").toBe(false);
    expect(r.firstLoadGzipKb, `${r.route}: ${r.firstLoadGzipKb} kB first-load JavaScript`).toBeLessThanOrEqual(BUDGET_KB);
  });
});
