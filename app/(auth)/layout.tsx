import { Wordmark } from "@/components/ui/brand";

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <main className="grid min-h-screen lg:grid-cols-[1fr_1.1fr]">
      <section className="hidden flex-col justify-between bg-pine-900 p-12 text-pine-50 lg:flex">
        <Wordmark inverted />
        <div className="max-w-md space-y-4">
          <p className="text-3xl font-extrabold leading-tight text-white">Every label starts from its neighbours.</p>
          <p className="text-pine-100">
            Vicinal proposes a label for each item from the nearest items your team has already labelled, shows how those neighbours
            voted, and turns many annotators&apos; work into one versioned, trustworthy labelled set.
          </p>
        </div>
        <p className="text-xs text-pine-100/70">Suggestions can anchor judgement: Vicinal keeps a blind share to measure that honestly.</p>
      </section>
      <section className="flex items-center justify-center p-6">
        <div className="w-full max-w-sm">
          <div className="mb-8 lg:hidden">
            <Wordmark />
          </div>
          {children}
        </div>
      </section>
    </main>
  );
}
