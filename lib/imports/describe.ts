import type { ImportIssue } from "./types";

/** "1 043": thousands grouped by a space, as the messages print row numbers. */
export function groupDigits(n: number): string {
  return String(n).replace(/\B(?=(\d{3})+(?!\d))/g, " ");
}

/** "row 1 043, column `depth_m`: 'n/a' is not a number". */
export function describe(issue: ImportIssue): string {
  const where = [issue.row != null ? `row ${groupDigits(issue.row)}` : null, issue.column != null ? `column \`${issue.column}\`` : null].filter(Boolean).join(", ");
  return where ? `${where}: ${issue.message}` : issue.message;
}
