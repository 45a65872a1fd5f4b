import { execFile } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { promisify } from "node:util";
import { afterEach, describe, expect, it, vi } from "vitest";
import { runAgreement } from "@/cli/commands/agreement";
import { CliError } from "@/cli/errors";
import { captureStdout } from "../../support/cli";

const dir = mkdtempSync(join(tmpdir(), "vicinal-agreement-"));
const FIXTURE = "tests/fixtures/agreement/krippendorff-2011-nominal.csv";

function csv(name: string, text: string): string {
  const path = join(dir, name);
  writeFileSync(path, text);
  return path;
}

afterEach(() => vi.restoreAllMocks());

describe("agreement command", () => {
  it("prints one JSON object with the agreed fields (Krippendorff 2011 nominal example: α = 0.743)", async () => {
    const out = await captureStdout(() => runAgreement(["--labels", FIXTURE, "--resamples", "200"]));
    expect(out.trim().split("\n")).toHaveLength(1);
    const report = JSON.parse(out);
    expect(report).toMatchObject({ items: 12, annotators: 4, ratings: 41, band: "substantial" });
    expect(report.krippendorffAlpha).toBeCloseTo(0.743, 3);
    expect(report.fleissKappa).toMatchObject({ items: 8, ratersPerItem: 4 });
    expect(report.cohenKappa[0]).toMatchObject({ a: "A", b: "B", n: 9 });
    expect(typeof report.percentAgreement).toBe("number");
    expect(report.krippendorffAlphaCi95.lower).toBeLessThan(report.krippendorffAlpha);
    expect(report.reading).toMatch(/^substantial agreement \(α = 0\.74, 95% CI /);
  });

  it("drops an exact repeat of a row and says so", async () => {
    const path = csv("repeat.csv", "item,annotator,label\n1,a,x\n1,b,x\n1,a,x\n2,a,y\n2,b,x\n");
    const report = JSON.parse(await captureStdout(() => runAgreement(["--labels", path, "--resamples", "0"])));
    expect(report).toMatchObject({ ratings: 4, repeatedRowsIgnored: 1 });
  });

  it.each([
    ["a missing file", () => [join(dir, "nope.csv")], /cannot read .*nope\.csv.*no such file/],
    ["an empty file", () => [csv("empty.csv", "")], /is empty/],
    ["a header without rows", () => [csv("header.csv", "item,annotator,label\n")], /header but no rating rows/],
    ["a missing column", () => [csv("nolabel.csv", "item,annotator\n1,a\n")], /lacks column 'label'/],
    ["an empty label cell", () => [csv("blank.csv", "item,annotator,label\n1,a,\n")], /row 2: empty 'label'/],
    [
      "the same (item, annotator) with two labels",
      () => [csv("dup.csv", "item,annotator,label\n1,a,x\n1,b,x\n1,a,y\n")],
      /annotator 'a' labelled item '1' twice with different labels \('x' on row 1, 'y' on row 3\)/,
    ],
  ])("rejects %s with a clear message", async (_, files, message) => {
    const promise = runAgreement(["--labels", ...files()]);
    await expect(promise).rejects.toBeInstanceOf(CliError);
    await expect(runAgreement(["--labels", ...files()])).rejects.toThrow(message);
  });

  it("rejects a missing --labels and a bad --resamples", async () => {
    await expect(runAgreement([])).rejects.toThrow(/missing --labels/);
    await expect(runAgreement(["--labels", FIXTURE, "--resamples", "many"])).rejects.toThrow(/bad --resamples/);
  });

  it("exits non-zero with the message on stderr through the real CLI entry", async () => {
    const run = promisify(execFile);
    const failure = await run("npx", ["tsx", "cli/index.ts", "agreement", "--labels", join(dir, "nope.csv")]).catch((e) => e);
    expect(failure.code).toBe(1);
    expect(failure.stderr).toMatch(/vicinal agreement: cannot read/);
  });
});
