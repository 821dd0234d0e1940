"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { authClient } from "@/lib/auth/client";
import { Notice, SubmitButton, TextField } from "@/components/ui";
import { describeAuthError, type AuthErrorDisplay } from "./auth-error";
import { authPageHref } from "./safe-next-path";

/** E-mail + password sign-in; returns to `next` (already checked to be a path on this site). */
export function SignInForm({ next }: { next: string }) {
  const router = useRouter();
  const [pending, setPending] = useState(false);
  const [problem, setProblem] = useState<AuthErrorDisplay | null>(null);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setPending(true);
    setProblem(null);
    const { error } = await authClient.signIn.email({
      email: String(form.get("email") ?? ""),
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

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4">
      {problem?.field === "form" ? <Notice tone="error">{problem.message}</Notice> : null}
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        required
        errors={problem?.field === "email" ? [problem.message] : undefined}
      />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="current-password"
        required
        errors={problem?.field === "password" ? [problem.message] : undefined}
      />
      <div className="flex items-center justify-between gap-3">
        <SubmitButton pending={pending} pendingLabel="Signing in…">
          Sign in
        </SubmitButton>
        <Link href="/forgot-password" className="text-sm">
          Forgot your password?
        </Link>
      </div>
      <p className="text-sm text-ink-muted">
        New to Bandwright? <Link href={authPageHref("/sign-up", next)}>Create an account</Link>
      </p>
    </form>
  );
}
