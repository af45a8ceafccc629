/**
 * A run's life: draft → planned → in progress → done, or cancelled on the way. A planned run may
 * go back to draft for changes; done and cancelled are final.
 */
export const RUN_STATUSES = ["draft", "planned", "in-progress", "done", "cancelled"] as const;
export type RunStatus = (typeof RUN_STATUSES)[number];

export const RUN_STATUS_LABELS: Readonly<Record<RunStatus, string>> = {
  draft: "Draft",
  planned: "Planned",
  "in-progress": "In progress",
  done: "Done",
  cancelled: "Cancelled",
};

export const RUN_TRANSITIONS: Readonly<Record<RunStatus, readonly RunStatus[]>> = {
  draft: ["planned", "cancelled"],
  planned: ["in-progress", "draft", "cancelled"],
  "in-progress": ["done", "cancelled"],
  done: [],
  cancelled: [],
};

/** Words for the button that moves a run to `to`. */
export const TRANSITION_ACTIONS: Readonly<Record<RunStatus, string>> = {
  draft: "Back to draft",
  planned: "Mark planned",
  "in-progress": "Start run",
  done: "Mark done",
  cancelled: "Cancel run",
};

export function canTransition(from: RunStatus, to: RunStatus): boolean {
  return RUN_TRANSITIONS[from].includes(to);
}

/** Its coats, part, line and racking may change only before the run starts. */
export function isEditable(status: RunStatus): boolean {
  return status === "draft" || status === "planned";
}

/** Runs that take time on the line (the board and the shift fill count them). */
export function occupiesLine(status: RunStatus): boolean {
  return status !== "cancelled";
}
