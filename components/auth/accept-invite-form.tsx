"use client";

import { useActionState } from "react";
import { acceptInvite } from "@/app/(auth)/actions";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/card";
import { Field, Input } from "@/components/ui/field";

export function AcceptInviteForm({ token, needsAccount, email }: { token: string; needsAccount: boolean; email: string }) {
  const [state, action, pending] = useActionState(acceptInvite, {});
  return (
    <form action={action} className="space-y-4" noValidate>
      <input type="hidden" name="token" value={token} />
      {state.error && !state.fieldErrors ? <Notice tone="error">{state.error}</Notice> : null}
      {needsAccount ? (
        <>
          <p className="text-sm text-ink-soft">
            Create your account for <strong className="text-ink">{email}</strong>.
          </p>
          <Field label="Your name" htmlFor="name" error={state.fieldErrors?.name}>
            <Input id="name" name="name" autoComplete="name" defaultValue={state.values?.name} required />
          </Field>
          <Field label="Choose a password" htmlFor="password" error={state.fieldErrors?.password} hint="At least 10 characters.">
            <Input id="password" name="password" type="password" autoComplete="new-password" invalid={Boolean(state.fieldErrors?.password)} required />
          </Field>
        </>
      ) : null}
      <Button type="submit" className="w-full" disabled={pending}>
        {pending ? "Joining…" : needsAccount ? "Create account and join" : "Accept invitation"}
      </Button>
    </form>
  );
}
