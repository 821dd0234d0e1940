import type { Metadata } from "next";
import { notFound } from "next/navigation";
import type { ReactNode } from "react";
import { authPageHref } from "@/components/auth/safe-next-path";
import { AcceptInvitationForm } from "@/components/workspaces/accept-invitation-form";
import { formatDateTime } from "@/components/format";
import { ButtonLink, Notice, RoleBadge } from "@/components/ui";
import { getInvitation } from "@/db/queries/workspaces";
import { getCurrentUser } from "@/lib/server/session";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Invitation" };

export default async function InvitationPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await getCurrentUser();
  const here = `/invitations/${encodeURIComponent(id)}`;

  // Signed-out visitors learn nothing about the invitation until they sign in as its addressee.
  if (!user) {
    return (
      <InvitationFrame title="You have been invited to a Bandwright workspace">
        <p className="text-sm text-ink-muted">
          Sign in, or create an account with the e-mail address the invitation was sent to. You come back here to accept it.
        </p>
        <div className="mt-5 flex flex-wrap gap-3">
          <ButtonLink href={authPageHref("/sign-up", here)}>Create an account</ButtonLink>
          <ButtonLink href={authPageHref("/sign-in", here)} variant="secondary">
            Sign in
          </ButtonLink>
        </div>
      </InvitationFrame>
    );
  }

  const invitation = await getInvitation(id);
  if (!invitation) notFound();
  // Only the addressee sees who invited them to which workspace.
  if (invitation.email !== user.email.toLowerCase()) {
    return (
      <InvitationFrame title="This invitation is for someone else">
        <Notice tone="warning">
          You are signed in as {user.email}, but the invitation was sent to a different address. Sign out and sign in with
          that address to accept it.
        </Notice>
      </InvitationFrame>
    );
  }

  const open = invitation.status === "pending" && invitation.expiresAt > new Date();
  return (
    <InvitationFrame title={`Join ${invitation.workspaceName}`}>
      <p className="text-sm text-ink-muted">
        {invitation.inviterName} invited you to work in <strong className="text-ink">{invitation.workspaceName}</strong> as{" "}
        <RoleBadge role={invitation.role} />.
      </p>
      {open ? (
        <>
          <p className="mt-1 text-xs text-ink-faint">The invitation is open until {formatDateTime(invitation.expiresAt)}.</p>
          <div className="mt-5">
            <AcceptInvitationForm invitationId={invitation.id} />
          </div>
        </>
      ) : (
        <Notice tone="warning" className="mt-4" title="This invitation is closed">
          {invitation.status === "accepted"
            ? "It has already been accepted."
            : "It has expired or was withdrawn. Ask the workspace owner for a new one."}
        </Notice>
      )}
    </InvitationFrame>
  );
}

function InvitationFrame({ title, children }: { title: string; children: ReactNode }) {
  return (
    <main className="mx-auto max-w-lg px-4 py-12">
      <div className="rounded-lg border border-line bg-surface p-6 shadow-sm">
        <h1 className="text-lg">{title}</h1>
        <div className="mt-3">{children}</div>
      </div>
    </main>
  );
}
