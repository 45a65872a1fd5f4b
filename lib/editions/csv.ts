/**
 * Spreadsheet formula injection: a cell starting with =, +, -, @, tab or carriage return may be run as a
 * formula when the file is opened in a spreadsheet (OWASP "CSV Injection"). Such cells get a leading
 * single quote, which spreadsheets show as text. Numbers are written by the exporter as numbers and never
 * pass through here, so a negative feature value keeps its sign.
 */
const risky = new Set(["=", "+", "-", "@", "\t", "\r"]);

export function neutraliseCell(text: string): string {
  return text.length > 0 && risky.has(text[0]) ? `'${text}` : text;
}

/** RFC 4180 quoting: fields holding a comma, quote or line break are quoted, quotes doubled. */
export function quoteCell(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export type CsvValue = string | number | boolean | null | undefined;

/** One cell: text is neutralised, then quoted; numbers and booleans are written plainly; missing is empty. */
export function csvCell(value: CsvValue): string {
  if (value === null || value === undefined) return "";
  if (typeof value === "number") return Number.isFinite(value) ? String(value) : "";
  if (typeof value === "boolean") return value ? "true" : "false";
  return quoteCell(neutraliseCell(value));
}

export function csvLine(values: CsvValue[]): string {
  return `${values.map(csvCell).join(",")}\r\n`;
}
