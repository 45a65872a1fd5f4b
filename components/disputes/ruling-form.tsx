"use client";

import { useState } from "react";
import type { DeskClass } from "@/components/desk/types";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/card";
import { Textarea } from "@/components/ui/field";
import { ApiError, apiFetch } from "@/lib/client/api";
import type { Ruling } from "./types";

/** The reviewer's Ruling: one class and the reason; a conflict (someone ruled first) shows the ruling that stands. */
export function RulingForm({ projectId, disputeId, classes, initialClassId, onRuled }: { projectId: number; disputeId: number; classes: DeskClass[]; initialClassId: number | null; onRuled: (r: Ruling, mine: boolean) => void }) {
  const [classId, setClassId] = useState<number | null>(initialClassId);
  const [reason, setReason] = useState("");
  const [errors, setErrors] = useState<{ classId?: string; reason?: string; form?: string }>({});
  const [busy, setBusy] = useState(false);

  async function submit() {
    const e: typeof errors = {};
    if (classId == null) e.classId = "Choose the final label.";
    if (reason.trim().length < 3) e.reason = "Give the reason for the ruling in a few words.";
    setErrors(e);
    if (e.classId || e.reason) return;
    setBusy(true);
    try {
      const res = await apiFetch<{ data: Ruling }>(`/api/v1/projects/${projectId}/disputes/${disputeId}/ruling`, { body: { classId, reason: reason.trim() } });
      onRuled(res.data, true);
    } catch (err) {
      if (err instanceof ApiError && err.status === 409) {
        const current = (err.details as { ruling?: Ruling } | undefined)?.ruling;
        setErrors({ form: err.message });
        if (current) onRuled(current, false);
      } else if (err instanceof ApiError) setErrors({ form: err.message, classId: err.fieldError("classId"), reason: err.fieldError("reason") });
      else setErrors({ form: "The ruling could not be sent. Check your connection." });
    } finally {
      setBusy(false);
    }
  }

  return (
    <form
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
      className="space-y-3"
    >
      {errors.form ? <Notice tone="error">{errors.form}</Notice> : null}
      <fieldset>
        <legend className="text-sm font-semibold text-ink">Final label</legend>
        <div className="mt-2 flex flex-wrap gap-2" role="radiogroup">
          {classes.map((c) => (
            <label key={c.id} className={`inline-flex cursor-pointer items-center gap-2 rounded-md border px-3 py-1.5 text-sm font-semibold has-[:focus-visible]:ring-2 has-[:focus-visible]:ring-amber-500 ${classId === c.id ? "border-pine-600 bg-pine-50 text-pine-900" : "border-line bg-paper-raised text-ink"}`}>
              <input type="radio" name={`ruling-${disputeId}`} value={c.id} checked={classId === c.id} onChange={() => setClassId(c.id)} className="sr-only" />
              <span aria-hidden="true" className="h-2.5 w-2.5 rotate-45 rounded-[2px]" style={{ background: c.colour }} />
              {c.name}
            </label>
          ))}
        </div>
        {errors.classId ? <p role="alert" className="mt-1 text-sm font-medium text-alarm-700">{errors.classId}</p> : null}
      </fieldset>
      <div>
        <label htmlFor={`ruling-reason-${disputeId}`} className="block text-sm font-semibold text-ink">
          Reason
        </label>
        <Textarea id={`ruling-reason-${disputeId}`} rows={2} value={reason} invalid={Boolean(errors.reason)} onChange={(e) => setReason(e.target.value)} className="mt-1" placeholder="e.g. pit depth and wall loss match Corroded, not Worn" />
        {errors.reason ? <p id={`ruling-reason-${disputeId}-error`} role="alert" className="mt-1 text-sm font-medium text-alarm-700">{errors.reason}</p> : null}
      </div>
      <Button type="submit" disabled={busy}>
        Issue ruling
      </Button>
    </form>
  );
}
