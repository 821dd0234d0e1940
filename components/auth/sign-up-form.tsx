"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { authClient } from "@/lib/auth/client";
import { userNameMaxLength } from "@/lib/auth/user-name";
import { Notice, SubmitButton, TextField } from "@/components/ui";
import { describeAuthError, type AuthErrorDisplay } from "./auth-error";
import { authPageHref } from "./safe-next-path";

interface SignUpFormProps {
  /** Where to go once the account exists (a path on this site). */
  next: string;
  /** The server's minimum password length, passed down so the hint and the check agree. */
  passwordMinLength: number;
}

/** Creates an account with name, e-mail and password, signs in, and continues to `next`. */
export function SignUpForm({ next, passwordMinLength }: SignUpFormProps) {
  const router = useRouter();
  const [pending, setPending] = useState(false);
  const [problem, setProblem] = useState<AuthErrorDisplay | null>(null);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setPending(true);
    setProblem(null);
    const { error } = await authClient.signUp.email({
      name: String(form.get("name") ?? "").trim(),
      email: String(form.get("email") ?? "").trim(),
      password: String(form.get("password") ?? ""),
    });
    if (error) {
      setProblem(describeAuthError(error));
      setPending(false);
      return;
    }
    router.replace(next);
    router.refresh();
  }

  const errorsFor = (field: AuthErrorDisplay["field"]) => (problem?.field === field ? [problem.message] : undefined);

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4">
      {problem?.field === "form" ? <Notice tone="error">{problem.message}</Notice> : null}
      <TextField
        label="Your name"
        name="name"
        autoComplete="name"
        required
        maxLength={userNameMaxLength}
        hint="Shown to the people you work with in a workspace."
        errors={errorsFor("name")}
      />
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        required
        hint="Use the address your invitation was sent to, if you have one."
        errors={errorsFor("email")}
      />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        minLength={passwordMinLength}
        hint={`At least ${passwordMinLength} characters; a short sentence works well.`}
        errors={errorsFor("password")}
      />
      <SubmitButton pending={pending} pendingLabel="Creating account…">
        Create account
      </SubmitButton>
      <p className="text-sm text-ink-muted">
        Already have an account? <Link href={authPageHref("/sign-in", next)}>Sign in</Link>
      </p>
    </form>
  );
}
