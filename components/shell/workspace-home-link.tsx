"use client";

import { useParams } from "next/navigation";
import { ButtonLink } from "@/components/ui";

/** "Back to the workspace" for pages without props (forbidden.tsx): the slug comes from the URL. */
export function WorkspaceHomeLink() {
  const { slug } = useParams<{ slug: string }>();
  return <ButtonLink href={`/w/${encodeURIComponent(slug)}`}>Back to the workspace</ButtonLink>;
}
