// Every exported route handler on disk, so coverage tests (access matrix, OpenAPI) fail when a route is added without them.
import fs from "node:fs";
import path from "node:path";

export const projectRoot = path.resolve(__dirname, "../..");
const methods = ["GET", "POST", "PUT", "PATCH", "DELETE"];

/** Every file below `dir` (absolute) whose name passes `keep`, as absolute paths. */
export function filesUnder(dir: string, keep: (name: string) => boolean): string[] {
  const out: string[] = [];
  for (const name of fs.readdirSync(dir)) {
    const full = path.join(dir, name);
    if (fs.statSync(full).isDirectory()) out.push(...filesUnder(full, keep));
    else if (keep(name)) out.push(full);
  }
  return out;
}

/** "METHOD /api/…/[param]" for every handler exported by a route.ts under `dir` (relative to the project root). */
export function routeHandlersOnDisk(dir = "app/api"): string[] {
  const appDir = path.join(projectRoot, "app");
  const out: string[] = [];
  for (const full of filesUnder(path.join(projectRoot, dir), (name) => name === "route.ts")) {
    const rel = `/${path.relative(appDir, path.dirname(full)).split(path.sep).join("/")}`;
    const src = fs.readFileSync(full, "utf8");
    for (const m of methods) if (new RegExp(`export (const|async function|function) ${m}\\b|export const \\{[^}]*\\b${m}\\b`).test(src)) out.push(`${m} ${rel}`);
  }
  return out.sort();
}
