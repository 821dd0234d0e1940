import type { Metadata } from "next";
import Link from "next/link";
import { ResetPasswordForm } from "@/components/auth/reset-password-form";
import { AuthCard } from "@/components/shell/auth-card";
import { Notice } from "@/components/ui";
import { passwordMinLength } from "@/lib/auth/server";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({
  searchParams,
}: {
  searchParams: Promise<{ token?: string | string[]; error?: string | string[] }>;
}) {
  const { token, error } = await searchParams;
  const tokenValue = Array.isArray(token) ? token[0] : token;
  return (
    <AuthCard title="Choose a new password">
      {tokenValue && !error ? (
        <ResetPasswordForm token={tokenValue} passwordMinLength={passwordMinLength} />
      ) : (
        <Notice tone="error" title="This link does not work">
          The reset link is missing its token or has expired. <Link href="/forgot-password">Request a new link</Link>.
        </Notice>
      )}
    </AuthCard>
  );
}
