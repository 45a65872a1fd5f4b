"use client";

import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";

/** While a background computation runs, re-renders the page every few seconds (at most for ten minutes). */
export function StaleRefresh({ everySeconds = 5 }: { everySeconds?: number }) {
  const router = useRouter();
  const [tries, setTries] = useState(0);
  useEffect(() => {
    if (tries * everySeconds > 600) return;
    const t = setTimeout(() => {
      router.refresh();
      setTries((n) => n + 1);
    }, everySeconds * 1000);
    return () => clearTimeout(t);
  }, [router, tries, everySeconds]);
  return <span className="sr-only" aria-live="polite">Waiting for the new figures…</span>;
}
