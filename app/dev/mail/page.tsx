import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { formatDateTime, linkSegments } from "@/components/format";
import { Brand } from "@/components/shell/brand";
import { EmptyState, Notice, PageHeader } from "@/components/ui";
import { isMailSinkEnabled, listSinkMessagesFor, type SinkMessage } from "@/lib/server/mail-sink";
import { requireUser } from "@/lib/server/session";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Development mail", robots: { index: false } };

/**
 * Development only: the e-mails the local SMTP sink delivered to the signed-in user's own address, so a
 * demo can follow invitation links. Never anyone else's mail, in any mode: the sink also holds other
 * users' password-reset links. Signed out → sign-in, then back here. Without a configured sink
 * (production) the page does not exist.
 */
export default async function DevMailPage() {
  if (!isMailSinkEnabled()) notFound();
  const user = await requireUser("/dev/mail");
  let messages: SinkMessage[] = [];
  let sinkDown = false;
  try {
    messages = await listSinkMessagesFor(user.email);
  } catch (error) {
    // A stopped sink is a development hiccup, not a broken page: say so and how to fix it.
    console.error(error);
    sinkDown = true;
  }
  return (
    <div className="mx-auto max-w-page px-4 py-8">
      <div className="mb-6">
        <Brand />
      </div>
      <PageHeader
        eyebrow="Development only"
        title="Your caught e-mail"
        description={`The messages the app sent to ${user.email}, newest first, as the local mail sink caught them. Nothing here reaches a real inbox; other users' mail is never shown.`}
      />
      {sinkDown ? (
        <Notice tone="warning" title="The mail sink is not answering">
          Start the app with <code className="font-mono">npm start</code>, which runs the sink beside it, then reload this page.
        </Notice>
      ) : messages.length === 0 ? (
        <EmptyState
          title="No e-mail yet"
          description="Invitations, password resets and fit notifications sent to your address show up here. Reload the page to check again."
        />
      ) : (
        <ol className="flex flex-col gap-4">
          {messages.map((message) => (
            <li key={message.id} className="rounded-lg border border-line bg-surface shadow-sm">
              <article aria-labelledby={`mail-${message.id}`}>
                <header className="border-b border-line px-4 py-3">
                  <h2 id={`mail-${message.id}`} className="text-base">
                    {message.subject}
                  </h2>
                  <p className="mt-0.5 text-xs text-ink-muted">
                    To {message.to} · {formatDateTime(message.receivedAt)}
                  </p>
                </header>
                <pre className="overflow-x-auto whitespace-pre-wrap px-4 py-3 font-sans text-sm">
                  {linkSegments(message.text).map((segment, i) =>
                    segment.kind === "link" ? (
                      <a key={i} href={segment.href}>
                        {segment.href}
                      </a>
                    ) : (
                      segment.text
                    ),
                  )}
                </pre>
              </article>
            </li>
          ))}
        </ol>
      )}
    </div>
  );
}
