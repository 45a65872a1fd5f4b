import { errorCatalogue, statusOfCode } from "@/lib/openapi/errors";
import { InlineText } from "./inline-text";

export function ErrorCodes() {
  const codes = Object.keys(errorCatalogue).sort((a, b) => statusOfCode(a) - statusOfCode(b) || a.localeCompare(b));
  return (
    <table className="w-full border-collapse text-left text-sm">
      <caption className="sr-only">Stable error codes</caption>
      <thead>
        <tr className="border-b border-line text-xs uppercase tracking-[0.06em] text-ink-faint">
          <th scope="col" className="py-1.5 pr-3 font-semibold">Status</th>
          <th scope="col" className="py-1.5 pr-3 font-semibold">Code</th>
          <th scope="col" className="py-1.5 font-semibold">Meaning</th>
        </tr>
      </thead>
      <tbody>
        {codes.map((c) => (
          <tr key={c} className="border-b border-line/60 last:border-0">
            <td className="py-1 pr-3 font-mono text-xs text-ink-soft">{statusOfCode(c)}</td>
            <td className="py-1 pr-3 font-mono text-[0.8rem] text-alarm-700">{c}</td>
            <td className="py-1 text-ink-soft"><InlineText text={errorCatalogue[c]} /></td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
