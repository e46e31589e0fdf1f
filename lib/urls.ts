import "server-only";

export const appUrl = () => (process.env.NEXTAUTH_URL || "http://127.0.0.1:3000").replace(/\/$/, "");
export const inviteUrl = (token: string) => `${appUrl()}/invite/${token}`;
