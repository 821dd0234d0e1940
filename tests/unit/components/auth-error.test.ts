import { describe, expect, it } from "vitest";
import { describeAuthError } from "@/components/auth/auth-error";

// Error codes are better-auth 1.7's own (its emailAndPassword and rate-limit responses).
describe("describeAuthError", () => {
  it("reports wrong credentials on the form without saying which field was wrong", () => {
    const shown = describeAuthError({ status: 401, code: "INVALID_EMAIL_OR_PASSWORD", message: "Invalid email or password" });
    expect(shown.field).toBe("form");
    expect(shown.message).not.toMatch(/password is wrong|e-mail is wrong/i);
  });

  it("points an existing account at the e-mail field", () => {
    expect(describeAuthError({ status: 422, code: "USER_ALREADY_EXISTS" }).field).toBe("email");
  });

  it("points a short password at the password field", () => {
    expect(describeAuthError({ status: 400, code: "PASSWORD_TOO_SHORT" })).toEqual({
      field: "password",
      message: "This password is too short.",
    });
  });

  it("explains rate limiting whatever the code", () => {
    expect(describeAuthError({ status: 429, code: "INVALID_EMAIL_OR_PASSWORD" }).message).toMatch(/Too many attempts/);
  });

  it("falls back to the server's message, then to a generic one", () => {
    expect(describeAuthError({ status: 500, message: "Database unavailable" }).message).toBe("Database unavailable");
    expect(describeAuthError({ status: 500 }).message).toBe("Something went wrong. Try again.");
  });
});
