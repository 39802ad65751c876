// The browser side of better-auth: sign-in, sign-up, sign-out, password reset and the session hook.
import { createAuthClient } from "better-auth/react";
import { adminClient } from "better-auth/client/plugins";

export const authClient = createAuthClient({ plugins: [adminClient()] });

export const { signIn, signUp, signOut, requestPasswordReset, resetPassword, sendVerificationEmail, useSession } = authClient;
