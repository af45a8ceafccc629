import { describe, expect, it } from "vitest";
import { canTransition, isEditable, RUN_STATUSES, type RunStatus } from "../../../lib/runs/status";

// The product's rule (PRODUCT.md, runs; issue 7): draft → planned → in progress → done, or cancelled.
const allowed: [RunStatus, RunStatus][] = [
  ["draft", "planned"],
  ["draft", "cancelled"],
  ["planned", "in-progress"],
  ["planned", "draft"],
  ["planned", "cancelled"],
  ["in-progress", "done"],
  ["in-progress", "cancelled"],
];

describe("run status transitions", () => {
  const all = RUN_STATUSES.flatMap((from) => RUN_STATUSES.map((to) => [from, to] as [RunStatus, RunStatus]));
  it.each(all)("%s → %s", (from, to) => {
    expect(canTransition(from, to)).toBe(allowed.some(([a, b]) => a === from && b === to));
  });

  it.each([
    ["draft", true],
    ["planned", true],
    ["in-progress", false],
    ["done", false],
    ["cancelled", false],
  ] as const)("a %s run is editable: %s", (s, editable) => {
    expect(isEditable(s)).toBe(editable);
  });
});
