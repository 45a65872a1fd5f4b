import { afterEach, describe, expect, it, vi } from "vitest";
import { runSuggest } from "@/cli/commands/suggest";
import { runTune } from "@/cli/commands/tune";
import { CliError } from "@/cli/errors";
import { captureStdout } from "../../support/cli";

const fx = (name: string) => `tests/fixtures/knn/${name}`;

afterEach(() => vi.restoreAllMocks());

describe("cli suggest", () => {
  it("prints one JSON object per item with shares and neighbours (hand-checked on a tiny table)", async () => {
    // x z-scored with mean 6, population sd √20.5; colour one-hot (blue, red), row d's colour missing → zeros.
    const out = await captureStdout(() => runSuggest(["--labelled", fx("tiny-labelled.csv"), "--items", fx("tiny-items.csv"), "--k", "3"]));
    const lines = out.trim().split("\n").map((l) => JSON.parse(l));
    expect(lines).toHaveLength(2);
    expect(lines[0].id).toBe("q1");
    expect(lines[0].label).toBe("cat");
    expect(lines[0].shares).toEqual({ cat: 2 / 3, dog: 1 / 3 });
    expect(lines[0].neighbours.map((n: { id: string }) => n.id)).toEqual(["a", "b", "d"]);
    // q1 → a: |1.4 − 1| / √20.5 in x, same colour → 0.4 / √20.5.
    expect(lines[0].neighbours[0].distance).toBeCloseTo(0.4 / Math.sqrt(20.5), 6);
    expect(lines[1]).toMatchObject({ id: "q2", label: "dog" });
  });

  it("inverse weighting and cosine run", async () => {
    const out = await captureStdout(() =>
      runSuggest(["--labelled", fx("tiny-labelled.csv"), "--items", fx("tiny-items.csv"), "--weighting", "inverse", "--distance", "cosine", "--scaling", "minmax"]),
    );
    const first = JSON.parse(out.split("\n")[0]);
    expect(Object.values(first.shares as Record<string, number>).reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
  });

  const errors: [string, string[], RegExp][] = [
    ["missing file", ["--labelled", fx("nope.csv"), "--items", fx("tiny-items.csv")], /file not found/],
    ["no label column", ["--labelled", fx("tiny-no-label.csv"), "--items", fx("tiny-items.csv")], /no label column 'label'/],
    ["unknown class", ["--labelled", fx("tiny-labelled.csv"), "--items", fx("tiny-items-unknown-class.csv")], /unknown class 'bird'/],
    ["non-numeric value", ["--labelled", fx("tiny-labelled.csv"), "--items", fx("tiny-items-bad-number.csv")], /'abc' is not a number/],
    ["columns do not match", ["--labelled", fx("tiny-labelled.csv"), "--items", fx("tiny-items-wrong-columns.csv")], /missing: colour; not in the labelled file: size/],
    ["bad distance", ["--labelled", fx("tiny-labelled.csv"), "--items", fx("tiny-items.csv"), "--distance", "chebyshev"], /--distance/],
    ["missing --items", ["--labelled", fx("tiny-labelled.csv")], /'--items' is required/],
  ];
  for (const [name, args, message] of errors) {
    it(`error: ${name}`, async () => {
      await expect(runSuggest(args)).rejects.toThrow(CliError);
      await expect(runSuggest(args)).rejects.toThrow(message);
    });
  }
});

describe("cli tune", () => {
  it("prints leave-one-out results for each k and distance", async () => {
    const out = await captureStdout(() => runTune(["--labelled", fx("tiny-labelled.csv"), "--k", "1,3", "--distance", "euclidean,manhattan"]));
    const parsed = JSON.parse(out);
    expect(parsed.results).toHaveLength(4);
    // k = 1: a↔b and c↔d are each other's nearest → 4 of 4 correct.
    expect(parsed.results[0]).toMatchObject({ k: 1, distance: "euclidean", accuracy: 1, correct: 4, n: 4 });
    // k = 3: each item's other three votes are 1 own class, 2 other class → 0 of 4.
    expect(parsed.results[1]).toMatchObject({ k: 3, correct: 0, n: 4 });
    expect(parsed.logLossSmoothing).toContain("0.001");
  });

  it("error: bad k list", async () => {
    await expect(runTune(["--labelled", fx("tiny-labelled.csv"), "--k", "1,zero"])).rejects.toThrow(/--k/);
  });
});
