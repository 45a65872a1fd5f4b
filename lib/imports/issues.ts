import { describe, groupDigits } from "./describe";
import { limits } from "./limits";

export { describe, groupDigits };
import type { ImportIssue } from "./types";

function quote(value: string): string {
  const shown = value.length > 60 ? `${value.slice(0, 57)}…` : value;
  return `'${shown}'`;
}

export const say = {
  notNumber: (v: string) => `${quote(v)} is not a number`,
  missingRejected: (v: string) => `${v === "" ? "the value is empty" : `${quote(v)} is a missing value`}, and this project rejects missing values (Settings → missing values)`,
  tooBigForFloat: (v: string) => `${quote(v)} is too large for a 32-bit float`,
  quote,
};

/** Collects issues: the first `storedErrors` are kept for the UI, up to `reportedErrors` for the CSV report. */
export class IssueLog {
  readonly all: ImportIssue[] = [];
  count = 0;

  add(issue: ImportIssue) {
    this.count += 1;
    if (this.all.length < limits.reportedErrors) this.all.push(issue);
  }

  get first(): ImportIssue[] {
    return this.all.slice(0, limits.storedErrors);
  }

  get full(): boolean {
    return this.all.length >= limits.reportedErrors;
  }

  toCsv(): string {
    const esc = (v: string) => (/[",\r\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v);
    const lines = ["row,column,message,description"];
    for (const i of this.all) lines.push([i.row == null ? "" : String(i.row), esc(i.column ?? ""), esc(i.message), esc(describe(i))].join(","));
    return `${lines.join("\n")}\n`;
  }
}

/** A whole-file problem that stops an import before any row is read. */
export class ImportFailure extends Error {
  constructor(message: string, readonly column: string | null = null) {
    super(message);
  }
}

/** The owner asked to stop; the transaction rolls back. */
export class ImportCancelled extends Error {}
