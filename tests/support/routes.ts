// Every exported route handler on disk, so coverage tests (access matrix, OpenAPI) fail when a route is added without them.
import fs from "node:fs";
import path from "node:path";

export const projectRoot = path.resolve(__dirname, "../..");
const methods = ["GET", "POST", "PUT", "PATCH", "DELETE"];

/** "METHOD /api/…/[param]" for every handler exported by a route.ts under `dir` (relative to the project root). */
export function routeHandlersOnDisk(dir = "app/api"): string[] {
  const appDir = path.join(projectRoot, "app");
  const out: string[] = [];
  const walk = (d: string) => {
    for (const name of fs.readdirSync(d)) {
      const full = path.join(d, name);
      if (fs.statSync(full).isDirectory()) walk(full);
      else if (name === "route.ts") {
        const rel = `/${path.relative(appDir, d).split(path.sep).join("/")}`;
        const src = fs.readFileSync(full, "utf8");
        for (const m of methods) if (new RegExp(`export (const|async function|function) ${m}\\b|export const \\{[^}]*\\b${m}\\b`).test(src)) out.push(`${m} ${rel}`);
      }
    }
  };
  walk(path.join(projectRoot, dir));
  return out.sort();
}
