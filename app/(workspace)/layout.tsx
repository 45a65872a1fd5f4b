import { TopBar } from "@/components/workspace/top-bar";
import { pageUser } from "@/lib/auth/page-access";

export default async function WorkspaceLayout({ children }: { children: React.ReactNode }) {
  const { user } = await pageUser();
  return (
    <div className="min-h-screen">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-paper-raised focus:px-3 focus:py-2">
        Skip to content
      </a>
      <TopBar user={{ name: user.name, email: user.email, isAdmin: user.isAdmin }} />
      <div id="main">{children}</div>
    </div>
  );
}
