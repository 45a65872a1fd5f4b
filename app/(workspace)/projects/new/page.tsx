import { PageHeader } from "@/components/ui/card";
import { NewProjectForm } from "@/components/projects/new-project-form";
import { pageUser } from "@/lib/auth/page-access";

export const metadata = { title: "New project" };

export default async function NewProjectPage() {
  await pageUser();
  return (
    <main className="mx-auto max-w-[900px] px-6 py-8">
      <PageHeader title="New project" subtitle="You become its owner. You can change every setting later." />
      <NewProjectForm />
    </main>
  );
}
