import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignInForm } from "@/components/auth/sign-in-form";
import { safeNextPath } from "@/components/auth/safe-next-path";
import { AuthCard } from "@/components/shell/auth-card";
import { getCurrentUser } from "@/lib/server/session";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string | string[] }> }) {
  const next = safeNextPath((await searchParams).next);
  if (await getCurrentUser()) redirect(next);
  return (
    <AuthCard title="Sign in to Bandwright" description="Use the e-mail and password of your account.">
      <SignInForm next={next} />
    </AuthCard>
  );
}
