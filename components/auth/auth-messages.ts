// Plain-language messages for the errors better-auth returns, keyed by its error codes.
const MESSAGES: Record<string, string> = {
  INVALID_EMAIL_OR_PASSWORD: "That e-mail address and password do not match an account.",
  USER_ALREADY_EXISTS: "An account with this e-mail address already exists. Sign in instead.",
  USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL: "An account with this e-mail address already exists. Sign in instead.",
  INVALID_TOKEN: "This link is no longer valid. Ask for a new one.",
  TOKEN_EXPIRED: "This link has expired. Ask for a new one.",
  PASSWORD_TOO_SHORT: "The password is too short.",
  PASSWORD_TOO_LONG: "The password is too long.",
  EMAIL_ALREADY_VERIFIED: "This address is already confirmed.",
};

export interface AuthClientError {
  code?: string;
  message?: string;
  status?: number;
}

export function authErrorMessage(error: AuthClientError): string {
  if (error.code && MESSAGES[error.code]) return MESSAGES[error.code];
  if (error.status === 429) return "Too many attempts. Wait a minute and try again.";
  return error.message || "Something went wrong. Try again.";
}
