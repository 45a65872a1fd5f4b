"use client";

import Link from "next/link";
import { useActionState, useState } from "react";
import { signInWithLink, signInWithPassword } from "@/app/(auth)/actions";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";
import { Notice } from "@/components/ui/card";

export function SignInForms({ callbackUrl, initialError }: { callbackUrl?: string; initialError?: string }) {
  const [mode, setMode] = useState<"password" | "link">("password");
  const [pw, pwAction, pwPending] = useActionState(signInWithPassword, {});
  const [link, linkAction, linkPending] = useActionState(signInWithLink, {});
  const state = mode === "password" ? pw : link;
  const error = state.error ?? (mode === "password" ? initialError : undefined);
  return (
    <div className="space-y-6">
      <div role="tablist" aria-label="Sign-in method" className="grid grid-cols-2 rounded-md border border-line bg-paper-sunk p-1 text-sm font-semibold">
        {(["password", "link"] as const).map((m) => (
          <button
            key={m}
            role="tab"
            type="button"
            aria-selected={mode === m}
            onClick={() => setMode(m)}
            className={`rounded px-3 py-1.5 ${mode === m ? "bg-paper-raised text-ink shadow-card" : "text-ink-soft hover:text-ink"}`}
          >
            {m === "password" ? "Password" : "E-mail link"}
          </button>
        ))}
      </div>
      {error ? <Notice tone="error">{error}</Notice> : null}
      {mode === "password" ? (
        <form action={pwAction} className="space-y-4" noValidate>
          <input type="hidden" name="callbackUrl" value={callbackUrl ?? ""} />
          <Field label="E-mail" htmlFor="email" error={pw.fieldErrors?.email}>
            <Input id="email" name="email" type="email" autoComplete="email" required defaultValue={pw.values?.email} invalid={Boolean(pw.fieldErrors?.email)} />
          </Field>
          <Field label="Password" htmlFor="password" error={pw.fieldErrors?.password}>
            <Input id="password" name="password" type="password" autoComplete="current-password" required invalid={Boolean(pw.fieldErrors?.password)} />
          </Field>
          <Button type="submit" className="w-full" disabled={pwPending}>
            {pwPending ? "Signing in…" : "Sign in"}
          </Button>
          <p className="text-center text-sm">
            <Link href="/forgot-password" className="font-semibold text-pine-700 underline-offset-2 hover:underline">
              Forgot your password?
            </Link>
          </p>
        </form>
      ) : (
        <form action={linkAction} className="space-y-4" noValidate>
          <input type="hidden" name="callbackUrl" value={callbackUrl ?? ""} />
          <Field label="E-mail" htmlFor="link-email" error={link.fieldErrors?.email} hint="We send a one-time link that works for 15 minutes.">
            <Input id="link-email" name="email" type="email" autoComplete="email" required defaultValue={link.values?.email} invalid={Boolean(link.fieldErrors?.email)} />
          </Field>
          <Button type="submit" className="w-full" disabled={linkPending}>
            {linkPending ? "Sending…" : "Send sign-in link"}
          </Button>
        </form>
      )}
    </div>
  );
}
