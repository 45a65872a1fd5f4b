"use client";

import { useActionState } from "react";
import { completeReset, requestReset } from "@/app/(auth)/actions";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/card";
import { Field, Input } from "@/components/ui/field";

export function RequestResetForm() {
  const [state, action, pending] = useActionState(requestReset, {});
  if (state.ok) return <Notice tone="success">{state.ok}</Notice>;
  return (
    <form action={action} className="space-y-4" noValidate>
      {state.error && !state.fieldErrors ? <Notice tone="error">{state.error}</Notice> : null}
      <Field label="E-mail" htmlFor="email" error={state.fieldErrors?.email}>
        <Input id="email" name="email" type="email" autoComplete="email" defaultValue={state.values?.email} invalid={Boolean(state.fieldErrors?.email)} />
      </Field>
      <Button type="submit" className="w-full" disabled={pending}>
        {pending ? "Sending…" : "Send reset link"}
      </Button>
    </form>
  );
}

export function NewPasswordForm({ token }: { token: string }) {
  const [state, action, pending] = useActionState(completeReset, {});
  return (
    <form action={action} className="space-y-4" noValidate>
      <input type="hidden" name="token" value={token} />
      {state.error && !state.fieldErrors ? <Notice tone="error">{state.error}</Notice> : null}
      <Field label="New password" htmlFor="password" error={state.fieldErrors?.password} hint="At least 10 characters.">
        <Input id="password" name="password" type="password" autoComplete="new-password" invalid={Boolean(state.fieldErrors?.password)} />
      </Field>
      <Field label="Repeat the new password" htmlFor="confirm" error={state.fieldErrors?.confirm}>
        <Input id="confirm" name="confirm" type="password" autoComplete="new-password" invalid={Boolean(state.fieldErrors?.confirm)} />
      </Field>
      <Button type="submit" className="w-full" disabled={pending}>
        {pending ? "Saving…" : "Set password and sign in"}
      </Button>
    </form>
  );
}
