/** A rendered e-mail, ready for the transport. */
export type MailMessage = { to: string; subject: string; text: string; html: string };

function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

/** The invitation e-mail; `acceptUrl` is `{APP_URL}/invitations/{id}`. */
export function invitationMessage(input: {
  to: string;
  workspaceName: string;
  inviterName: string;
  role: string;
  acceptUrl: string;
}): MailMessage {
  const { to, workspaceName, inviterName, role, acceptUrl } = input;
  const subject = `${inviterName} invited you to ${workspaceName} on Bandwright`;
  const text = [
    `${inviterName} invited you to join the workspace "${workspaceName}" on Bandwright as ${role}.`,
    "",
    `Open this link to accept: ${acceptUrl}`,
    "",
    "If you did not expect this invitation, ignore this e-mail.",
  ].join("\n");
  const html =
    `<p>${escapeHtml(inviterName)} invited you to join the workspace <strong>${escapeHtml(workspaceName)}</strong> ` +
    `on Bandwright as ${escapeHtml(role)}.</p>` +
    `<p><a href="${escapeHtml(acceptUrl)}">Accept the invitation</a></p>` +
    "<p>If you did not expect this invitation, ignore this e-mail.</p>";
  return { to, subject, text, html };
}

/** The password-reset e-mail; `resetUrl` is `{APP_URL}/reset-password?token=…`. */
export function passwordResetMessage(input: { to: string; name: string; resetUrl: string }): MailMessage {
  const { to, name, resetUrl } = input;
  const subject = "Reset your Bandwright password";
  const text = [
    `Hello ${name},`,
    "",
    `Open this link to choose a new password: ${resetUrl}`,
    "The link works once and expires in one hour. If you did not ask for it, ignore this e-mail.",
  ].join("\n");
  const html =
    `<p>Hello ${escapeHtml(name)},</p>` +
    `<p><a href="${escapeHtml(resetUrl)}">Choose a new password</a></p>` +
    "<p>The link works once and expires in one hour. If you did not ask for it, ignore this e-mail.</p>";
  return { to, subject, text, html };
}

/** Tells the launcher that a fit revision ended; `revisionUrl` is `{APP_URL}/w/{slug}/fits/{fitId}/revisions/{n}`. */
export function fitFinishedMessage(input: {
  to: string;
  fitName: string;
  revision: number;
  status: "succeeded" | "cancelled" | "failed";
  /** unweighted RMS of the residuals, eV (absent when the fit failed) */
  rms?: number;
  /** why a failed fit failed, in words */
  reason?: string;
  revisionUrl: string;
}): MailMessage {
  const { to, fitName, revision, status, rms, reason, revisionUrl } = input;
  const outcome = { succeeded: "finished", cancelled: "was cancelled", failed: "failed" }[status];
  const subject = `Fit "${fitName}" revision ${revision} ${outcome}`;
  const details = [rms === undefined ? "" : `RMS of the residuals: ${(rms * 1000).toFixed(1)} meV.`, reason ? `Reason: ${reason}` : ""].filter(
    (line) => line !== "",
  );
  const text = [`Revision ${revision} of the fit "${fitName}" ${outcome}.`, ...details, "", `See the result: ${revisionUrl}`].join("\n");
  const html =
    `<p>Revision ${revision} of the fit <strong>${escapeHtml(fitName)}</strong> ${outcome}.</p>` +
    details.map((line) => `<p>${escapeHtml(line)}</p>`).join("") +
    `<p><a href="${escapeHtml(revisionUrl)}">See the result</a></p>`;
  return { to, subject, text, html };
}
