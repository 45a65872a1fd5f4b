// A file over the configured size limit: this file runs in its own process with a 1 kB limit.
import { beforeAll, describe, expect, it } from "vitest";

process.env.UPLOAD_MAX_BYTES = "1000";

describe("file over the size limit", () => {
  let helpers: typeof import("./helpers");
  let fixtures: typeof import("@/tests/support/fixtures");
  beforeAll(async () => {
    helpers = await import("./helpers");
    fixtures = await import("@/tests/support/fixtures");
  });

  it("fails before reading a row and stores zero items", async () => {
    const { project } = await fixtures.makeProject();
    const imp = await helpers.importFixtures(project.id, ["malformed/oversize.csv"], { format: "csv", columns: [{ name: "id", role: "id" }, { name: "depth_m", role: "numeric" }] });
    expect(imp.status).toBe("failed");
    expect(imp.message).toMatch(/`oversize\.csv` is 1\.8 kB; the limit per file is 1\.0 kB/);
    expect(await helpers.itemCount(project.id)).toBe(0);
  });
});
