"use client";

import Link from "next/link";
import { useState, type FormEvent } from "react";
import { authClient } from "@/lib/auth/client";
import { Notice, SubmitButton, TextField } from "@/components/ui";
import { describeAuthError, type AuthErrorDisplay } from "./auth-error";

interface ResetPasswordFormProps {
  /** The token from the e-mailed link. */
  token: string;
  passwordMinLength: number;
}

/** Sets a new password with the token from a reset e-mail; other sessions are signed out. */
export function ResetPasswordForm({ token, passwordMinLength }: ResetPasswordFormProps) {
  const [pending, setPending] = useState(false);
  const [done, setDone] = useState(false);
  const [problem, setProblem] = useState<AuthErrorDisplay | null>(null);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const newPassword = String(form.get("password") ?? "");
    if (newPassword !== String(form.get("confirm") ?? "")) {
      setProblem({ field: "password", message: "The two passwords differ." });
      return;
    }
    setPending(true);
    setProblem(null);
    const { error } = await authClient.resetPassword({ newPassword, token });
    setPending(false);
    if (error) {
      setProblem(describeAuthError(error));
      return;
    }
    setDone(true);
  }

  if (done) {
    return (
      <Notice tone="success" title="Password changed">
        Your new password is set. <Link href="/sign-in">Sign in</Link> with it.
      </Notice>
    );
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4">
      {problem?.field === "form" ? <Notice tone="error">{problem.message}</Notice> : null}
      <TextField
        label="New password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        minLength={passwordMinLength}
        hint={`At least ${passwordMinLength} characters.`}
        errors={problem?.field === "password" ? [problem.message] : undefined}
      />
      <TextField label="Repeat the new password" name="confirm" type="password" autoComplete="new-password" required />
      <SubmitButton pending={pending} pendingLabel="Saving…">
        Set new password
      </SubmitButton>
    </form>
  );
}
