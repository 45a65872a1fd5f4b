"use client";

import { useState } from "react";
import { ApiError } from "@/lib/client/api";

export type FormNotice = { tone: "error" | "success"; text: string };

/** What a successful send leads to: a success notice on the same page, or leaving the page (the button stays pending). */
export type SubmitOutcome = { notice: string } | { leaving: true };

/**
 * Submit state of a project form. On an API error it shows the server's message and its field errors keyed
 * by path ("name", "settings.k"); on any other failure, `failure`.
 */
export function useProjectSubmit(failure: string) {
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [notice, setNotice] = useState<FormNotice | null>(null);
  const [pending, setPending] = useState(false);

  const submit = (send: () => Promise<SubmitOutcome>) => async (e: React.FormEvent) => {
    e.preventDefault();
    setPending(true);
    setNotice(null);
    setErrors({});
    try {
      const outcome = await send();
      if ("leaving" in outcome) return;
      setNotice({ tone: "success", text: outcome.notice });
    } catch (err) {
      if (err instanceof ApiError) {
        setNotice({ tone: "error", text: err.message });
        setErrors(Object.fromEntries(err.fields.map((f) => [f.path, f.message])));
      } else setNotice({ tone: "error", text: failure });
    }
    setPending(false);
  };

  return { errors, notice, pending, submit };
}
