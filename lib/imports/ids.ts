import { AppError } from "@/lib/errors";

const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Import and upload ids are UUIDs; anything else is simply not found. */
export function importIdOf(value: string, what: "import" | "upload" = "import"): string {
  if (!uuid.test(value)) throw new AppError(`not_found:${what}`, `No such ${what}.`);
  return value.toLowerCase();
}
