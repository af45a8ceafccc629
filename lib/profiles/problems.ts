/**
 * What can be wrong with a logger file or its column mapping. Each problem names the request
 * field it belongs to (`mapping.airColumn`, `csv`) and, for a bad cell, the file's row (1-based
 * line number, as a spreadsheet shows it) and the column's header.
 */
import { DomainError } from "../coating-math/errors";

export interface ProfileProblem {
  /** dot path of the input at fault: `csv`, `mapping.timeColumn`, `mapping.probes.1.thicknessMm` … */
  field: string;
  message: string;
  /** 1-based line of the file (cell problems only) */
  row?: number;
  /** header of the column (cell and column problems) */
  column?: string;
}

/** Thrown when a profile cannot be stored: carries every problem found, not just the first. */
export class ProfileInputError extends DomainError {
  readonly problems: ProfileProblem[];

  constructor(problems: ProfileProblem[]) {
    const first = problems[0];
    super(first?.field ?? "csv", first ? first.message : "The profile is not valid.");
    this.name = "ProfileInputError";
    this.problems = problems;
  }
}
