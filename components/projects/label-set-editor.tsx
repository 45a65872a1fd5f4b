"use client";

import { labelPalette } from "@/lib/projects/settings";
import { Input } from "@/components/ui/field";

export type ClassDraft = { name: string; colour: string };

export function LabelSetEditor({ value, onChange, errors }: { value: ClassDraft[]; onChange: (v: ClassDraft[]) => void; errors: Record<string, string> }) {
  const set = (i: number, patch: Partial<ClassDraft>) => onChange(value.map((c, j) => (j === i ? { ...c, ...patch } : c)));
  return (
    <fieldset className="space-y-2">
      <legend className="text-sm font-semibold text-ink">Label set</legend>
      <p className="text-xs text-ink-faint">Two to nine labels. Each gets a key (1–9) on the Desk, in this order.</p>
      <ol className="space-y-2">
        {value.map((c, i) => (
          <li key={i} className="flex items-start gap-3">
            <kbd className="num mt-2 inline-flex h-6 w-6 items-center justify-center rounded border border-line-strong bg-paper text-xs font-bold text-ink-soft">{i + 1}</kbd>
            <div className="flex-1">
              <label htmlFor={`class-${i}`} className="sr-only">
                Label {i + 1} name
              </label>
              <Input id={`class-${i}`} value={c.name} onChange={(e) => set(i, { name: e.target.value })} placeholder={`Label ${i + 1}`} invalid={Boolean(errors[`classes.${i}.name`])} />
              {errors[`classes.${i}.name`] ? <p className="mt-1 text-sm font-medium text-alarm-700">{errors[`classes.${i}.name`]}</p> : null}
            </div>
            <div role="radiogroup" aria-label={`Colour of label ${i + 1}`} className="mt-1.5 flex flex-wrap gap-1">
              {labelPalette.map((p) => (
                <button
                  key={p.value}
                  type="button"
                  role="radio"
                  aria-checked={c.colour === p.value}
                  title={p.name}
                  aria-label={p.name}
                  onClick={() => set(i, { colour: p.value })}
                  className={`h-6 w-6 rounded-full border-2 ${c.colour === p.value ? "border-ink" : "border-transparent"}`}
                  style={{ background: p.value }}
                />
              ))}
            </div>
            <button type="button" onClick={() => onChange(value.filter((_, j) => j !== i))} disabled={value.length <= 2} className="mt-1.5 rounded px-2 py-1 text-sm text-ink-faint hover:text-alarm-700 disabled:opacity-30" aria-label={`Remove label ${i + 1}`}>
              ✕
            </button>
          </li>
        ))}
      </ol>
      {value.length < 9 ? (
        <button
          type="button"
          onClick={() => onChange([...value, { name: "", colour: labelPalette[value.length % labelPalette.length].value }])}
          className="rounded-md px-2 py-1 text-sm font-semibold text-pine-700 hover:bg-pine-50"
        >
          + Add a label
        </button>
      ) : null}
      {errors.classes ? <p className="text-sm font-medium text-alarm-700">{errors.classes}</p> : null}
    </fieldset>
  );
}
