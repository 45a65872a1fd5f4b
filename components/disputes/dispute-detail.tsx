"use client";

import { useState } from "react";
import useSWR from "swr";
import { ItemFields } from "@/components/desk/item-fields";
import { NeighbourList } from "@/components/desk/neighbour-list";
import type { DeskClass, DeskColumn } from "@/components/desk/types";
import { VicinityDial } from "@/components/desk/vicinity-dial";
import { Card, Notice } from "@/components/ui/card";
import { fetcher } from "@/lib/client/api";
import { ClassChip, VoteBars } from "./class-chip";
import { RulingForm } from "./ruling-form";
import type { DisputeDetail as Detail } from "./types";

const sourceText: Record<string, string> = { agreed: "agreed by the annotators", single: "single annotator", ruling: "earlier ruling", control: "known (control)" };

export function DisputeDetail({ projectId, disputeId, classes, columns, onRuled }: { projectId: number; disputeId: number; classes: DeskClass[]; columns: DeskColumn[]; onRuled: (text: string, mine: boolean) => void }) {
  const url = `/api/v1/projects/${projectId}/disputes/${disputeId}`;
  const { data, error, mutate } = useSWR<{ data: Detail }>(url, fetcher);
  const [notice, setNotice] = useState<{ tone: "success" | "caution"; text: string } | null>(null);
  const byId = new Map(classes.map((c) => [c.id, c]));
  if (error) return <Notice tone="error">This dispute could not be loaded: {(error as Error).message}</Notice>;
  if (!data) return <p className="text-sm text-ink-faint">Loading the dispute…</p>;
  const { dispute, item, flags, suggestion, ruling } = data.data;
  const isDoubt = dispute.reason === "doubt";
  return (
    <div className="space-y-4">
      <Card title={`${item.externalId} · ${isDoubt ? "doubted label" : "annotators disagree"}`}>
        <div className="space-y-4">
          {isDoubt ? (
            <div className="text-sm text-ink-soft">
              <p>
                Current final label: <ClassChip cls={dispute.finalClassId != null ? byId.get(dispute.finalClassId) : undefined} strong />{" "}
                {dispute.finalSource ? <span className="text-xs text-ink-faint">({sourceText[dispute.finalSource] ?? dispute.finalSource})</span> : null}
              </p>
              {dispute.note ? <p className="mt-1">Owner&apos;s note: {dispute.note}</p> : null}
            </div>
          ) : null}
          {dispute.labels.length ? (
            <div>
              <h3 className="text-xs font-bold uppercase tracking-[0.1em] text-ink-faint">Labels</h3>
              <ul className="mt-2 divide-y divide-line rounded-md border border-line">
                {dispute.labels.map((l) => (
                  <li key={l.labelId} className="flex items-center gap-3 px-3 py-2 text-sm">
                    <span className="min-w-32 font-semibold text-ink">{l.annotatorName ?? "(no name)"}</span>
                    <ClassChip cls={byId.get(l.classId)} />
                    <span className="ml-auto text-xs text-ink-faint">
                      {l.suggestion?.shown ? (l.tookSuggestion ? "took the suggestion" : `saw ${byId.get(l.suggestion.topClassId ?? -1)?.name ?? "no vote"} suggested`) : "labelled without a suggestion"}
                    </span>
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
          {flags.filter((f) => f.comment).length ? (
            <div>
              <h3 className="text-xs font-bold uppercase tracking-[0.1em] text-ink-faint">Comments from the Desk</h3>
              <ul className="mt-1 space-y-1 text-sm text-ink-soft">
                {flags.filter((f) => f.comment).map((f, i) => (
                  <li key={i}>
                    <span className="font-semibold text-ink">{f.name ?? "An annotator"}</span> ({f.kind === "flag" ? "unclear" : "skipped"}): {f.comment}
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
          <ItemFields fields={item.fields} columns={columns} imageUrl={item.imageUrl} externalId={item.externalId} />
        </div>
      </Card>
      <Card title={isDoubt ? "What the neighbours say" : "Suggestion now"}>
        {suggestion && suggestion.topClassId != null ? (
          <div className="space-y-4">
            <VoteBars classes={classes} shares={suggestion.shares} />
            <div className="grid items-start gap-4 lg:grid-cols-[auto_1fr]">
              <VicinityDial neighbours={suggestion.neighbours} classes={classes} size={170} />
              <NeighbourList neighbours={suggestion.neighbours} classes={classes} columns={columns} itemFields={item.fields} />
            </div>
          </div>
        ) : (
          <p className="text-sm text-ink-soft">No neighbour votes for this item yet.</p>
        )}
      </Card>
      <Card title="Ruling">
        {notice ? (
          <div className="mb-3">
            <Notice tone={notice.tone}>{notice.text}</Notice>
          </div>
        ) : null}
        {ruling ? (
          <div className="space-y-1 text-sm">
            <p>
              <ClassChip cls={byId.get(ruling.classId)} strong /> by <strong>{ruling.reviewerName ?? "a reviewer"}</strong>, {new Date(ruling.createdAt).toLocaleString("en-GB")}
            </p>
            <p className="text-ink-soft">Reason: {ruling.reason}</p>
          </div>
        ) : (
          <RulingForm
            key={dispute.id}
            projectId={projectId}
            disputeId={dispute.id}
            classes={classes}
            initialClassId={isDoubt ? null : (suggestion?.topClassId ?? null)}
            onRuled={(r, mine) => {
              if (!mine) setNotice({ tone: "caution", text: `${r.reviewerName ?? "Another reviewer"} ruled on this dispute first (${r.className}); your ruling was not saved.` });
              void mutate();
              onRuled(mine ? `Ruling on ${item.externalId} saved: ${r.className}.` : "", mine);
            }}
          />
        )}
      </Card>
    </div>
  );
}
