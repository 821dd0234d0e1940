import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignUpForm } from "@/components/auth/sign-up-form";
import { safeNextPath } from "@/components/auth/safe-next-path";
import { AuthCard } from "@/components/shell/auth-card";
import { passwordMinLength } from "@/lib/auth/server";
import { getCurrentUser } from "@/lib/server/session";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Create an account" };

export default async function SignUpPage({ searchParams }: { searchParams: Promise<{ next?: string | string[] }> }) {
  const next = safeNextPath((await searchParams).next);
  if (await getCurrentUser()) redirect(next);
  return (
    <AuthCard title="Create your account" description="One account works in every workspace you are invited to.">
      <SignUpForm next={next} passwordMinLength={passwordMinLength} />
    </AuthCard>
  );
}
