import "server-only";
import type { SuggestionSnapshot } from "@/db/schema";
import { decodeCursor, encodeCursor } from "@/lib/http/cursor";
import { AppError } from "@/lib/errors";

type Shown = { i: number; u: string; s: SuggestionSnapshot };
const scope = "desk-suggestion";

/** What the Desk displayed, signed so the label can store it without trusting the browser's copy. */
export function signSnapshot(itemId: number, userId: string, snapshot: SuggestionSnapshot): string {
  return encodeCursor(scope, { i: itemId, u: userId, s: snapshot } satisfies Shown);
}

export function readSnapshot(token: string | undefined | null, itemId: number, userId: string): SuggestionSnapshot | null {
  if (!token) return null;
  let shown: Shown | null;
  try {
    shown = decodeCursor<Shown>(scope, token);
  } catch {
    throw new AppError("bad_request:suggestion_token", "suggestionToken: not a suggestion this server showed.");
  }
  if (!shown || shown.i !== itemId || shown.u !== userId) {
    throw new AppError("bad_request:suggestion_token", "suggestionToken: it belongs to another item or annotator.");
  }
  return shown.s;
}

export const blindSnapshot = (): SuggestionSnapshot => ({ shown: false, topClassId: null, shares: {}, k: 0, distance: "", engineVersion: "", knnVersion: 0 });
