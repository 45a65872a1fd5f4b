import Link from "next/link";
import { signOutAction } from "@/app/(auth)/actions";
import { Wordmark } from "@/components/ui/brand";

export function TopBar({ user }: { user: { name: string | null; email: string; isAdmin: boolean } }) {
  return (
    <header className="border-b border-line bg-paper-raised">
      <div className="mx-auto flex h-14 max-w-[1400px] items-center gap-6 px-6">
        <Link href="/projects" aria-label="Vicinal, your projects">
          <Wordmark />
        </Link>
        <nav aria-label="Main" className="flex items-center gap-1 text-sm font-semibold">
          <Link href="/projects" className="rounded px-3 py-1.5 text-ink-soft hover:bg-paper-sunk hover:text-ink">
            Projects
          </Link>
          <Link href="/api-docs" className="rounded px-3 py-1.5 text-ink-soft hover:bg-paper-sunk hover:text-ink">
            API
          </Link>
          {user.isAdmin ? (
            <Link href="/admin" className="rounded px-3 py-1.5 text-ink-soft hover:bg-paper-sunk hover:text-ink">
              Admin
            </Link>
          ) : null}
        </nav>
        <div className="ml-auto flex items-center gap-3 text-sm">
          <Link href="/account" className="rounded px-2 py-1 text-right hover:bg-paper-sunk">
            <span className="block font-semibold leading-tight text-ink">{user.name ?? user.email}</span>
            <span className="block text-xs leading-tight text-ink-faint">{user.isAdmin ? "site admin · " : ""}{user.email}</span>
          </Link>
          <form action={signOutAction}>
            <button type="submit" className="rounded-md border border-line px-3 py-1.5 font-semibold text-ink-soft hover:border-line-strong hover:text-ink">
              Sign out
            </button>
          </form>
        </div>
      </div>
    </header>
  );
}
