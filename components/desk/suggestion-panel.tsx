import { Card } from "@/components/ui/card";
import { NeighbourList } from "./neighbour-list";
import { ShareLadder } from "./share-ladder";
import type { DeskClass, DeskColumn, DeskItem } from "./types";
import { VicinityDial } from "./vicinity-dial";

/** The Suggestion beside the item: the class chooser with every class's vote share, the dial and the neighbours. */
export function SuggestionPanel({ item, classes, columns, onChoose, onTake }: { item: DeskItem; classes: DeskClass[]; columns: DeskColumn[]; onChoose: (c: DeskClass) => void; onTake: () => void }) {
  const s = item.suggestion;
  const hasVote = s != null && s.topClassId != null;
  const top = hasVote ? classes.find((c) => c.id === s.topClassId) : undefined;
  return (
    <Card
      title="Suggestion"
      action={hasVote ? <span className="text-xs text-ink-faint">k = {s.k} · {s.distance}{s.weighting === "inverse" ? " · distance-weighted" : ""}</span> : null}
    >
      <div className="space-y-4">
        {hasVote && top ? (
          <p className="text-sm text-ink-soft">
            The {s.neighbours.length} nearest labelled items mostly say <strong className="text-ink">{top.name}</strong> ({Math.round((s.shares[String(top.id)] ?? 0) * 100)}% of the vote).
          </p>
        ) : (
          <p className="rounded-md border border-dashed border-line-strong bg-paper px-3 py-2 text-sm text-ink-soft">No suggestion for this item. Judge it from its fields.</p>
        )}
        <ShareLadder classes={classes} suggestion={hasVote ? s : null} disabled={false} onChoose={onChoose} onTake={onTake} />
        {hasVote && s.neighbours.length ? (
          <div className="grid items-start gap-4 2xl:grid-cols-[auto_minmax(0,1fr)]">
            <div className="flex justify-center">
              <VicinityDial neighbours={s.neighbours} classes={classes} />
            </div>
            <NeighbourList neighbours={s.neighbours} classes={classes} columns={columns} itemFields={item.fields} />
          </div>
        ) : null}
      </div>
    </Card>
  );
}
