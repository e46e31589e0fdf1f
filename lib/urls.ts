import "server-only";

export const appUrl = () => (process.env.NEXTAUTH_URL || "http://127.0.0.1:3000").replace(/\/$/, "");
export const inviteUrl = (token: string) => `${appUrl()}/invite/${token}`;
/** The link in a sign-up confirmation e-mail (the page posts the token to /api/sign-up/confirm). */
export const confirmSignUpUrl = (token: string) => `${appUrl()}/sign-up/confirm/${token}`;
export const signInUrl = () => `${appUrl()}/sign-in`;
