// CSV cells: formula-injection neutralising and RFC 4180 quoting, read back with papaparse (an independent parser).
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { csvCell, csvLine, neutraliseCell } from "@/lib/editions/csv";

describe("neutraliseCell", () => {
  // The risky first characters are those OWASP's "CSV Injection" page lists: = + - @ tab carriage-return (recalled from memory).
  it.each(["=SUM(A1:A9)", "+1+2", "-2+3", "@cmd", "\tx", "\r=1"])("prefixes %j with a single quote", (value) => {
    expect(neutraliseCell(value)).toBe(`'${value}`);
  });

  it.each(["plain", "1+2", "a=b", " =1", "", "'quoted", "ÿ=1"])("leaves %j as it is", (value) => {
    expect(neutraliseCell(value)).toBe(value);
  });

  it("writes numbers as numbers, so a negative feature keeps its sign and is not quoted", () => {
    expect(csvCell(-2.5)).toBe("-2.5");
    expect(csvCell("-2.5")).toBe("'-2.5");
    expect(csvCell(Number.NaN)).toBe("");
    expect(csvCell(null)).toBe("");
    expect(csvCell(true)).toBe("true");
  });
});

describe("csvLine", () => {
  it("round-trips through papaparse with commas, quotes and line breaks, and the injection prefix stays visible as text", () => {
    const cells = ["a,b", 'say "hi"', "two\nlines", "=HYPERLINK(\"http://x\")", "\r\n", 3];
    const text = csvLine(cells) + csvLine(["x", "y", "z", "w", "v", -1]);
    const parsed = Papa.parse<string[]>(text.trimEnd(), { newline: "\r\n" });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data[0]).toEqual(["a,b", 'say "hi"', "two\nlines", "'=HYPERLINK(\"http://x\")", "'\r\n", "3"]);
    expect(parsed.data[1]).toEqual(["x", "y", "z", "w", "v", "-1"]);
    for (const cell of parsed.data[0]) expect(/^[=+\-@\t\r]/.test(cell)).toBe(false);
  });
});
