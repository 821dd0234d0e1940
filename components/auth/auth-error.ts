/** The error shape better-auth's client returns beside `data`. */
export interface AuthClientError {
  status: number;
  code?: string;
  message?: string;
}

/** Which form field an auth error belongs to (or the whole form), with a message for people. */
export interface AuthErrorDisplay {
  field: "email" | "password" | "name" | "form";
  message: string;
}

/**
 * Turns a better-auth client error into a message placed at the field it concerns.
 * Wrong credentials are reported on the form as a whole, never saying which of the two was wrong.
 * @param error - the `error` member of a better-auth client result
 */
export function describeAuthError(error: AuthClientError): AuthErrorDisplay {
  if (error.status === 429) return { field: "form", message: "Too many attempts. Wait a minute, then try again." };
  switch (error.code) {
    case "INVALID_EMAIL_OR_PASSWORD":
      return { field: "form", message: "That e-mail and password do not match an account." };
    case "USER_ALREADY_EXISTS":
    case "USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL":
      return { field: "email", message: "An account with this e-mail already exists. Sign in instead." };
    case "INVALID_EMAIL":
      return { field: "email", message: "Enter a valid e-mail address." };
    case "PASSWORD_TOO_SHORT":
      return { field: "password", message: "This password is too short." };
    case "PASSWORD_TOO_LONG":
      return { field: "password", message: "This password is too long." };
    case "INVALID_TOKEN":
      return { field: "form", message: "This reset link is invalid or has expired. Request a new one." };
    default:
      return { field: "form", message: error.message ?? "Something went wrong. Try again." };
  }
}
