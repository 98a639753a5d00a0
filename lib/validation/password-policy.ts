/** Shared by the sign-up form and the server's better-auth configuration. */
export const minimumPasswordLength = 10;
