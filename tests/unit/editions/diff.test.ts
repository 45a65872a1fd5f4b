import { describe, expect, it } from "vitest";
import { type DiffChange, type IndexEntry, compareUtf8, diffIndexes, indexLine, parseIndexLine } from "@/lib/editions/diff";

async function* from(list: IndexEntry[]) {
  for (const e of list) yield e;
}

describe("compareUtf8", () => {
  it("orders like UTF-8 bytes (PostgreSQL collate \"C\"), unlike JS's UTF-16 order for astral characters", () => {
    const astral = "\u{1F600}"; // UTF-8 F0 9F 98 80
    const bmpHigh = "\uFF21"; // UTF-8 EF BC A1
    expect(Buffer.compare(Buffer.from(bmpHigh), Buffer.from(astral))).toBe(-1);
    expect(compareUtf8(bmpHigh, astral)).toBeLessThan(0);
    expect(bmpHigh < astral).toBe(false);
    const words = ["b", "a", "ab", "B", "é", astral, bmpHigh, ""];
    const bytes = [...words].sort((x, y) => Buffer.compare(Buffer.from(x), Buffer.from(y)));
    expect([...words].sort(compareUtf8)).toEqual(bytes);
  });
});

describe("diffIndexes", () => {
  it("counts added, removed, relabelled and unchanged items", async () => {
    const before: IndexEntry[] = [
      { id: "a", label: "cat", source: "agreed" },
      { id: "b", label: "dog", source: "agreed" },
      { id: "c", label: "cat", source: "single" },
      { id: "d", label: null, source: "disputed" },
    ];
    const after: IndexEntry[] = [
      { id: "b", label: "cat", source: "ruling" },
      { id: "c", label: "cat", source: "ruling" },
      { id: "d", label: "dog", source: "ruling" },
      { id: "e", label: "dog", source: "agreed" },
    ];
    const changes: DiffChange[] = [];
    const counts = await diffIndexes(from(before), from(after), (c) => void changes.push(c));
    expect(counts).toEqual({ before: 4, after: 4, added: 1, removed: 1, relabelled: 2, unchanged: 1 });
    expect(changes.map((c) => `${c.externalId}:${c.change}`)).toEqual(["a:removed", "b:relabelled", "d:relabelled", "e:added"]);
    expect(changes[1].before?.label).toBe("dog");
    expect(changes[1].after?.label).toBe("cat");
  });

  it("rejects an index that is not sorted", async () => {
    const bad = [{ id: "b", label: "x", source: "agreed" }, { id: "a", label: "x", source: "agreed" }];
    await expect(diffIndexes(from(bad), from([]), () => undefined)).rejects.toThrow(/out of order/);
  });

  it("index lines survive tabs, quotes and line breaks in external ids", () => {
    const e = { id: 'we\t"ird"\nid', label: null, source: "disputed" };
    expect(indexLine(e).split("\n").length).toBe(2);
    expect(parseIndexLine(indexLine(e).trim())).toEqual(e);
  });
});
