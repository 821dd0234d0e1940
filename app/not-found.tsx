import type { Metadata } from "next";
import { Brand } from "@/components/shell/brand";
import { ButtonLink, EmptyState } from "@/components/ui";

export const metadata: Metadata = { title: "Page not found" };

export default function NotFound() {
  return (
    <div className="mx-auto flex max-w-xl flex-col gap-8 px-4 py-12">
      <Brand />
      <main>
        <EmptyState
          title="Page not found"
          description="Nothing lives at this address. If someone sent you a link, check that it is complete."
          action={<ButtonLink href="/">Go to the start page</ButtonLink>}
        />
      </main>
    </div>
  );
}
