import type { Metadata } from "next";
import Link from "next/link";
import { ForgotPasswordForm } from "@/components/auth/forgot-password-form";
import { AuthCard } from "@/components/shell/auth-card";

export const metadata: Metadata = { title: "Reset your password" };

export default function ForgotPasswordPage() {
  return (
    <AuthCard title="Reset your password" description="Enter your account's e-mail and we send you a link to choose a new password.">
      <ForgotPasswordForm />
      <p className="mt-4 text-sm text-ink-muted">
        Remembered it? <Link href="/sign-in">Sign in</Link>
      </p>
    </AuthCard>
  );
}
