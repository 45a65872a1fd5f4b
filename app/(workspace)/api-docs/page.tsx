import Link from "next/link";
import type { DocOperation } from "@/components/api-docs/curl";
import { ErrorCodes } from "@/components/api-docs/error-codes";
import { Paragraphs } from "@/components/api-docs/inline-text";
import { OperationCard } from "@/components/api-docs/operation-card";
import type { Components } from "@/components/api-docs/schema-text";
import { Card, PageHeader } from "@/components/ui/card";
import { pageUser } from "@/lib/auth/page-access";
import { env } from "@/lib/env";
import { buildOpenApiDocument } from "@/lib/openapi/document";

export const metadata = { title: "API" };

const methodOrder = ["get", "post", "put", "patch", "delete"];

export default async function ApiDocsPage() {
  await pageUser();
  const doc = buildOpenApiDocument();
  const components = (doc.components?.schemas ?? {}) as Components;
  const baseUrl = env.APP_URL.replace(/\/$/, "");
  const ops: Array<DocOperation & { tag: string }> = Object.entries(doc.paths ?? {}).flatMap(([path, item]) =>
    Object.entries(item as Record<string, Omit<DocOperation, "method" | "path"> & { tags?: string[] }>)
      .filter(([m]) => methodOrder.includes(m))
      .map(([method, op]) => ({ ...op, method, path, tag: op.tags?.[0] ?? "Other" })),
  );
  const tags = (doc.tags ?? []).map((t) => ({ ...t, ops: ops.filter((o) => o.tag === t.name) })).filter((t) => t.ops.length);
  return (
    <main className="mx-auto grid max-w-[1400px] gap-8 px-6 py-8 lg:grid-cols-[220px_1fr]">
      <nav aria-label="API sections" className="hidden lg:block">
        <div className="sticky top-6 space-y-1 text-sm">
          <p className="mb-2 text-xs font-bold uppercase tracking-[0.08em] text-ink-faint">Sections</p>
          {tags.map((t) => (
            <a key={t.name} href={`#tag-${t.name}`} className="flex justify-between rounded px-2 py-1 text-ink-soft hover:bg-paper-sunk hover:text-ink">
              <span>{t.name}</span>
              <span className="text-ink-faint">{t.ops.length}</span>
            </a>
          ))}
          <a href="#errors" className="block rounded px-2 py-1 text-ink-soft hover:bg-paper-sunk hover:text-ink">Error codes</a>
        </div>
      </nav>
      <div className="min-w-0 space-y-8">
        <PageHeader
          title="REST API v1"
          subtitle={`${ops.length} operations · OpenAPI ${doc.openapi}`}
          actions={
            <>
              <Link href="/account" className="rounded-md border border-line bg-paper-raised px-4 py-2 text-sm font-semibold text-ink hover:border-line-strong">
                Create a token
              </Link>
              <a href="/api/v1/openapi.json" className="rounded-md bg-pine-600 px-4 py-2 text-sm font-semibold text-white hover:bg-pine-700">
                openapi.json
              </a>
            </>
          }
        />
        <div className="grid gap-6 xl:grid-cols-2">
          <Card title="How it works">
            <Paragraphs text={doc.info.description ?? ""} className="text-sm text-ink-soft" />
          </Card>
          <Card title="First call">
            <p className="mb-3 text-sm text-ink-soft">Create a token on your account page, keep it in an environment variable, and list your projects:</p>
            <pre className="overflow-x-auto rounded-md bg-ink px-4 py-3 font-mono text-[0.8rem] leading-relaxed text-paper">
              <code>{`export VICINAL_TOKEN=vcn_…\ncurl -sS "${baseUrl}/api/v1/projects" \\\n  -H "Authorization: Bearer $VICINAL_TOKEN"`}</code>
            </pre>
            <p className="mt-3 text-sm text-ink-soft">
              A pipeline typically creates items in batches, syncs settled labels with <code className="font-mono text-ink">since</code>, then publishes an Edition and downloads its files.
            </p>
          </Card>
        </div>
        {tags.map((t) => (
          <section key={t.name} id={`tag-${t.name}`} aria-labelledby={`h-${t.name}`} className="scroll-mt-6 space-y-3">
            <div>
              <h2 id={`h-${t.name}`} className="text-lg font-extrabold tracking-tight text-ink">{t.name}</h2>
              {t.description ? <p className="text-sm text-ink-soft">{t.description}</p> : null}
            </div>
            <div className="space-y-2">
              {t.ops.map((op) => (
                <OperationCard key={`${op.method} ${op.path}`} op={op} baseUrl={baseUrl} components={components} />
              ))}
            </div>
          </section>
        ))}
        <section id="errors" className="scroll-mt-6">
          <Card title="Error codes">
            <p className="mb-3 text-sm text-ink-soft">
              Every error answers <code className="font-mono text-ink">{`{ "error": { "code", "message", "fields?" } }`}</code>. Branch on the code; show the message.
            </p>
            <ErrorCodes />
          </Card>
        </section>
      </div>
    </main>
  );
}
