import { z } from "zod";
import { AppError } from "./errors";

/** Parses `value` with `schema`; on failure throws validation_failed carrying every field's messages. */
export function parseInput<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const parsed = schema.safeParse(value);
  if (parsed.success) return parsed.data;
  const { formErrors, fieldErrors } = z.flattenError(parsed.error);
  const issues: Record<string, string[]> = {};
  for (const [field, messages] of Object.entries(fieldErrors)) {
    if (Array.isArray(messages) && messages.length > 0) issues[field] = messages;
  }
  if (formErrors.length > 0) issues._form = formErrors;
  const firstMessage = Object.values(issues)[0]?.[0];
  throw new AppError("validation_failed", firstMessage ?? "Some fields are invalid.", { issues });
}
