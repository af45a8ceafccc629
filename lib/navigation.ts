import type { Role } from "@/db/schema";

export interface NavItem {
  href: string;
  label: string;
  /** Roles that see the item; admin sees everything. */
  roles: readonly Role[] | "all";
  /** "account": shown beside the user's name (settings and administration), not among the work sections */
  area?: "account";
}

// Only sections that exist are listed; each capability adds its entry when its screen lands.
export const navItems: NavItem[] = [
  { href: "/", label: "Today", roles: "all" },
  { href: "/runs", label: "Runs", roles: ["supervisor", "operator", "manager"] },
  { href: "/board", label: "Day board", roles: ["supervisor", "manager"] },
  { href: "/parts", label: "Parts", roles: "all" },
  { href: "/racking", label: "Racking", roles: ["engineer", "supervisor", "manager"] },
  { href: "/coatings", label: "Coatings", roles: "all" },
  { href: "/lines", label: "Lines", roles: "all" },
  { href: "/throughput", label: "Throughput", roles: ["manager", "supervisor"] },
  { href: "/profiles", label: "Oven profiles", roles: ["supervisor", "engineer", "manager"] },
  { href: "/quality", label: "Quality", roles: ["supervisor", "manager"] },
  { href: "/forecast", label: "Forecast", roles: ["purchaser", "manager"] },
  { href: "/purchase-requests", label: "Purchasing", roles: ["purchaser"] },
  { href: "/feedback", label: "Utilisation", roles: ["supervisor", "manager"] },
  { href: "/calculators", label: "Calculators", roles: "all" },
  { href: "/admin/users", label: "Users", roles: ["admin"], area: "account" },
  { href: "/admin/outbox", label: "Mail outbox", roles: ["admin"], area: "account" },
  { href: "/settings", label: "Settings", roles: "all", area: "account" },
];

export function navFor(role: Role): NavItem[] {
  return navItems.filter((i) => i.roles === "all" || role === "admin" || i.roles.includes(role));
}
