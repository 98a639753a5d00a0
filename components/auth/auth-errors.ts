// better-auth answers with error codes; the forms turn them into a message beside the right field.
export type AuthField = "name" | "email" | "password" | "root";

export function authErrorToField(error: { code?: string; message?: string; status?: number }): { field: AuthField; message: string } {
  switch (error.code) {
    case "INVALID_EMAIL_OR_PASSWORD":
      return { field: "password", message: "That e-mail and password do not match an account. Check both and try again." };
    case "USER_ALREADY_EXISTS":
    case "USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL":
      return { field: "email", message: "An account with this e-mail already exists. Sign in instead, or use another address." };
    case "INVALID_EMAIL":
      return { field: "email", message: "Enter a valid e-mail address, like name@example.com." };
    case "PASSWORD_TOO_SHORT":
      return { field: "password", message: "The password is too short." };
    case "PASSWORD_TOO_LONG":
      return { field: "password", message: "The password is too long (at most 128 characters)." };
    default:
      if (error.status === 429) return { field: "root", message: "Too many attempts. Wait a minute and try again." };
      return { field: "root", message: error.message || "Something went wrong. Try again." };
  }
}
