/** Types of scripts/bundle-budget.mjs, for the budget test. */
export interface RouteFirstLoad {
  /** the page's URL pattern, route groups removed: "/parts/[id]" */
  route: string;
  /** first-load JavaScript, gzip, in kB (1024 bytes), one decimal */
  firstLoadGzipKb: number;
  /** whether three.js is in that first load */
  three: boolean;
}

export function measureRoutes(): RouteFirstLoad[];
