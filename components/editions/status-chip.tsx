import { type EditionSummary, statusTone, statusWord } from "./api";

export function StatusChip({ status }: { status: EditionSummary["status"] }) {
  return <span className={`inline-flex whitespace-nowrap rounded-full border px-2 py-0.5 text-xs font-bold ${statusTone[status]}`}>{statusWord[status]}</span>;
}
