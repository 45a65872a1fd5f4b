/** How long after a label its annotator may still undo it (server-enforced). */
export const UNDO_WINDOW_SECONDS = 10;
/** A label is "settled" for incremental sync once it can no longer be undone, plus a grace for in-flight commits. */
export const SYNC_SETTLE_SECONDS = UNDO_WINDOW_SECONDS + 5;
/** At most this many items per annotator may be named in `exclude` when prefetching. */
export const MAX_EXCLUDE = 4;
/** Open disputes e-mail digests go out at most this often per project. */
export const DIGEST_MIN_INTERVAL_MINUTES = 60;
