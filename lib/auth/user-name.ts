import { z } from "zod";

/** Longest display name an account may have (it appears in e-mail subjects and member tables). */
export const userNameMaxLength = 120;

export const userNameSchema = z
  .string({ error: "Name is required." })
  .trim()
  .min(1, { error: "Name is required." })
  .max(userNameMaxLength, { error: `Name must be at most ${userNameMaxLength} characters.` });
