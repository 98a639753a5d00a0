"use client";
// better-auth's browser client: sign-up, sign-in, sign-out and switching the active team.
import { organizationClient } from "better-auth/client/plugins";
import { createAuthClient } from "better-auth/react";

export const authClient = createAuthClient({ plugins: [organizationClient()] });
