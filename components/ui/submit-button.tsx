"use client";

import type { ReactNode } from "react";
import { useFormStatus } from "react-dom";
import { Button, type ButtonSize, type ButtonVariant } from "./button";

interface SubmitButtonProps {
  children: ReactNode;
  /** Text shown while the form is being submitted, e.g. "Creating…". */
  pendingLabel: string;
  variant?: ButtonVariant;
  size?: ButtonSize;
  /** Submits as this named value (e.g. the intent of one of several buttons). */
  name?: string;
  value?: string;
  /** Set when the pending state is known outside a <form action> (client-side submit handlers). */
  pending?: boolean;
}

/** Submit button that shows progress while its form's action runs, so the page never looks frozen. */
export function SubmitButton({ children, pendingLabel, pending, ...rest }: SubmitButtonProps) {
  const status = useFormStatus();
  const isPending = pending ?? status.pending;
  return (
    <Button type="submit" aria-disabled={isPending} disabled={isPending} {...rest}>
      {isPending ? pendingLabel : children}
    </Button>
  );
}
