"use client";

import { startTransition, useActionState, useRef, type FormEvent } from "react";
import { initialActionState, type ActionState } from "@/lib/server/action-state";

type FormAction = (previous: ActionState, formData: FormData) => Promise<ActionState>;

/**
 * Runs a server action from a form without React's automatic form reset, so a refused submission keeps
 * what the user typed; the form is cleared only when the action reports success.
 * @param action - a `(prevState, formData) => Promise<ActionState>` server action
 */
export function useActionForm(action: FormAction) {
  const formRef = useRef<HTMLFormElement>(null);
  const [state, dispatch, pending] = useActionState(async (previous: ActionState, formData: FormData) => {
    const next = await action(previous, formData);
    if (next.ok) formRef.current?.reset();
    return next;
  }, initialActionState);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const formData = new FormData(event.currentTarget);
    startTransition(() => dispatch(formData));
  }

  /** Messages for one field from the last refused submission. */
  const errorsFor = (field: string): string[] | undefined => state.fieldErrors?.[field];

  return { state, pending, onSubmit, formRef, errorsFor };
}
