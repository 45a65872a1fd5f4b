import { curlExample, type DocOperation } from "./curl";
import { FieldTable } from "./field-table";
import { InlineText, Paragraphs } from "./inline-text";
import { type Components, constraints, fieldRows, type FieldRow } from "./schema-text";

const methodTone: Record<string, string> = {
  get: "bg-pine-50 text-pine-700 border-pine-100",
  post: "bg-amber-50 text-amber-700 border-amber-100",
  patch: "bg-amber-50 text-amber-700 border-amber-100",
  put: "bg-amber-50 text-amber-700 border-amber-100",
  delete: "bg-alarm-50 text-alarm-700 border-alarm-500/30",
};

const roleText: Record<string, string> = { public: "public", user: "any user", admin: "site admin", viewer: "viewer+", annotator: "annotator+", reviewer: "reviewer+", owner: "owner" };

export function MethodBadge({ method }: { method: string }) {
  return <span className={`inline-block w-16 rounded border px-1.5 py-0.5 text-center font-mono text-xs font-bold uppercase ${methodTone[method] ?? ""}`}>{method}</span>;
}

function Section({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <section className="space-y-2">
      <h4 className="text-xs font-bold uppercase tracking-[0.08em] text-ink-faint">{title}</h4>
      {children}
    </section>
  );
}

export function OperationCard({ op, baseUrl, components }: { op: DocOperation; baseUrl: string; components: Components }) {
  const role = op["x-vicinal-role"] ?? "user";
  const params: FieldRow[] = (op.parameters ?? []).map((p) => ({ path: p.name, type: `${p.in} · ${p.schema?.type ?? "string"}`, required: Boolean(p.required), description: p.description ?? p.schema?.description, notes: p.schema ? constraints(p.schema) : [] }));
  const bodyTypes = Object.keys(op.requestBody?.content ?? {});
  const body = op.requestBody?.content["application/json"]?.schema;
  const statuses = Object.entries(op.responses);
  const ok = statuses.filter(([s]) => Number(s) < 400);
  const errors = op["x-vicinal-error-codes"] ?? [];
  return (
    <details id={op.operationId} className="group rounded-card border border-line bg-paper-raised shadow-card open:shadow-none">
      <summary className="flex cursor-pointer list-none items-center gap-3 px-4 py-2.5 hover:bg-paper-sunk/60 [&::-webkit-details-marker]:hidden">
        <MethodBadge method={op.method} />
        <code className="font-mono text-sm text-ink">{op.path}</code>
        <span className="hidden text-sm text-ink-soft md:inline">{op.summary}</span>
        <span className="ml-auto rounded-full border border-line px-2 py-0.5 text-xs font-semibold text-ink-soft" title="Required role">
          {roleText[role] ?? role}
        </span>
        <span aria-hidden="true" className="text-ink-faint transition-transform group-open:rotate-90">›</span>
      </summary>
      <div className="space-y-5 border-t border-line px-5 py-4">
        <div>
          <h3 className="text-base font-bold text-ink">{op.summary}</h3>
          {op.description ? <Paragraphs text={op.description} className="mt-1 text-sm text-ink-soft" /> : null}
        </div>
        {params.length ? (
          <Section title="Parameters">
            <FieldTable rows={params} caption={`Parameters of ${op.summary}`} />
          </Section>
        ) : null}
        {body ? (
          <Section title={`Request body · ${bodyTypes.join(", ")}`}>
            <FieldTable rows={fieldRows(body, components)} caption={`Request body of ${op.summary}`} />
          </Section>
        ) : null}
        <Section title="Responses">
          <ul className="space-y-3">
            {ok.map(([status, r], i) => {
              const schema = r.content?.["application/json"]?.schema;
              const same = i > 0 && JSON.stringify(schema) === JSON.stringify(ok[i - 1][1].content?.["application/json"]?.schema);
              return (
                <li key={status} className="space-y-1.5">
                  <p className="text-sm">
                    <span className="mr-2 rounded bg-pine-50 px-1.5 py-0.5 font-mono text-xs font-bold text-pine-700">{status}</span>
                    <span className="text-ink-soft">{r.description}</span>
                  </p>
                  {schema && same ? <p className="text-xs text-ink-faint">Same fields as {ok[i - 1][0]}.</p> : schema ? <FieldTable rows={fieldRows(schema, components)} caption={`Response ${status}`} /> : null}
                </li>
              );
            })}
          </ul>
        </Section>
        {errors.length ? (
          <Section title="Error codes">
            <ul className="flex flex-wrap gap-1.5">
              {errors.map((c) => (
                <li key={c} className="rounded border border-line bg-paper px-1.5 py-0.5 font-mono text-xs text-alarm-700">
                  {c}
                </li>
              ))}
            </ul>
          </Section>
        ) : null}
        <Section title="Example">
          <pre className="overflow-x-auto rounded-md bg-ink px-4 py-3 font-mono text-[0.8rem] leading-relaxed text-paper">
            <code>{curlExample(op, baseUrl, components)}</code>
          </pre>
          {op.security?.length === 1 ? <p className="text-xs text-ink-faint"><InlineText text="Needs a signed-in browser session; API tokens are refused here." /></p> : null}
        </Section>
      </div>
    </details>
  );
}
