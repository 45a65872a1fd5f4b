import { AgreementReportView, type Scope } from "@/components/agreement/agreement-report";
import { dateTime } from "@/components/agreement/format";
import { StaleRefresh } from "@/components/agreement/stale-refresh";
import { EmptyState, Notice, PageHeader } from "@/components/ui/card";
import { getAgreementView } from "@/lib/agreement-server";
import { pageRole } from "@/lib/auth/page-access";

export const metadata = { title: "Agreement" };

export default async function AgreementPage({ params, searchParams }: { params: Promise<{ projectId: string }>; searchParams: Promise<{ scope?: string }> }) {
  const { projectId } = await params;
  const { scope: scopeParam } = await searchParams;
  const access = await pageRole(projectId, "viewer");
  const view = await getAgreementView({ projectId: access.project.id, userId: access.user.id, role: access.role, isAdmin: access.isAdmin });
  const scope: Scope = scopeParam === "blind" ? "blind" : "all";
  const data = view.report;
  return (
    <main>
      <PageHeader
        title="Agreement"
        subtitle={
          data
            ? `How far annotators agree beyond chance, with the uncertainty of every figure. Computed ${dateTime(data.computedAt)} from ${data.labels.toLocaleString("en")} labels in ${data.seconds.toFixed(2)} s.`
            : "How far annotators agree beyond chance, with the uncertainty of every figure."
        }
      />
      {view.stale || view.status === "computing" ? (
        <div className="mb-6">
          <Notice tone="caution" title={view.status === "computing" ? "Computing the first report" : "Labels changed since these figures"}>
            {view.status === "computing"
              ? "This project is large, so the figures are being computed in the background. This page refreshes by itself."
              : "Fresh figures are being computed in the background; these are from the previous labels. This page refreshes by itself."}
          </Notice>
          <StaleRefresh />
        </div>
      ) : null}
      {!view.namesVisible ? <p className="mb-4 text-xs text-ink-faint">Annotators are numbered: only owners and reviewers see who is who.</p> : null}
      {data ? (
        data.overall.ratings === 0 ? (
          <EmptyState title="No labels yet">Agreement appears here once annotators have labelled items at the Desk, two or more of them on the same items.</EmptyState>
        ) : (
          <AgreementReportView data={data} scope={scope} base={`/projects/${access.project.id}/agreement`} />
        )
      ) : null}
    </main>
  );
}
