"use client";

import { useState, type FormEvent } from "react";
import { authClient } from "@/lib/auth/client";
import { Notice, SubmitButton, TextField } from "@/components/ui";
import { describeAuthError } from "./auth-error";

/** Asks for a password-reset e-mail. The answer is the same whether or not the account exists. */
export function ForgotPasswordForm() {
  const [pending, setPending] = useState(false);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const email = String(new FormData(event.currentTarget).get("email") ?? "").trim();
    setPending(true);
    setProblem(null);
    const { error } = await authClient.requestPasswordReset({ email, redirectTo: "/reset-password" });
    setPending(false);
    if (error) {
      setProblem(describeAuthError(error).message);
      return;
    }
    setSentTo(email);
  }

  if (sentTo) {
    return (
      <Notice tone="success" title="Check your e-mail">
        If an account exists for {sentTo}, a link to choose a new password is on its way. It works for one hour.
      </Notice>
    );
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4">
      {problem ? <Notice tone="error">{problem}</Notice> : null}
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        required
        hint="We send a reset link to this address."
      />
      <SubmitButton pending={pending} pendingLabel="Sending…">
        Send reset link
      </SubmitButton>
    </form>
  );
}
