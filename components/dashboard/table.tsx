import type { ReactNode } from "react";

export const th = "px-2 py-1.5 text-left text-[11px] font-bold uppercase tracking-[0.04em] text-ink-faint";
export const td = "px-2 py-1.5 align-top";
export const tdNum = `${td} num text-right`;

/** The numbers behind a chart, folded under "Show as table" (open by default when `open`). */
export function ChartTable({ caption, children, open = false }: { caption: string; children: ReactNode; open?: boolean }) {
  return (
    <details className="group mt-3 rounded-md border border-line bg-paper" open={open}>
      <summary className="cursor-pointer select-none px-3 py-1.5 text-xs font-semibold text-pine-700 hover:text-pine-900">
        <span className="group-open:hidden">Show as table</span>
        <span className="hidden group-open:inline">Hide table</span>
      </summary>
      <div className="overflow-x-auto border-t border-line">
        <table className="w-full text-[13px]">
          <caption className="sr-only">{caption}</caption>
          {children}
        </table>
      </div>
    </details>
  );
}

export function Swatch({ colour, label }: { colour: string; label?: string }) {
  return <span className="inline-block h-2.5 w-2.5 shrink-0 rounded-sm" style={{ background: colour }} aria-hidden={label ? undefined : true} aria-label={label} />;
}

/** The key under a dashboard chart: one swatch and name per series; `strong` marks the viewer's own series. */
export function Legend({ entries }: { entries: ReadonlyArray<{ key: string; label: string; colour: string; strong?: boolean }> }) {
  return (
    <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft">
      {entries.map((e) => (
        <li key={e.key} className={e.strong ? "inline-flex items-center gap-1.5 font-bold text-ink" : "inline-flex items-center gap-1.5"}>
          <Swatch colour={e.colour} />
          {e.label}
        </li>
      ))}
    </ul>
  );
}

/** A dashboard panel: a one-line verdict on top, the chart, then its table. */
export function Panel({ title, verdict, children, className = "", id }: { title: string; verdict?: ReactNode; children: ReactNode; className?: string; id?: string }) {
  const headingId = id ? `${id}-title` : undefined;
  return (
    <section aria-labelledby={headingId} className={`flex flex-col rounded-card border border-line bg-paper-raised p-5 shadow-card ${className}`}>
      <h2 id={headingId} className="text-xs font-bold uppercase tracking-[0.12em] text-ink-faint">
        {title}
      </h2>
      {verdict ? <p className="mt-1 text-base font-bold leading-snug text-ink">{verdict}</p> : null}
      <div className="mt-3 flex-1">{children}</div>
    </section>
  );
}
