import { PageHeader } from "@/components/ui/card";
import { MembersPanel } from "@/components/projects/members-panel";
import { pageRole } from "@/lib/auth/page-access";

export const metadata = { title: "Members" };

export default async function MembersPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const access = await pageRole(projectId, "viewer");
  const canManage = access.isAdmin || access.role === "owner";
  return (
    <main className="max-w-[1000px]">
      <PageHeader title="Members" subtitle={canManage ? "Invite people by e-mail and decide what each may do in this project." : "Who works on this project."} />
      <MembersPanel projectId={access.project.id} canManage={canManage} selfId={access.user.id} />
    </main>
  );
}
