/** Which review e-mail a member gets, and how each choice reads (the API checks it in shared/schemas/users.ts). */
export const NOTIFY_PREFS = ["all", "mentions_signoffs", "none"] as const;
export type NotifyPref = (typeof NOTIFY_PREFS)[number];
export const NOTIFY_LABEL: Record<NotifyPref, string> = {
  all: "Every comment and reply on linkages I follow, and sign-offs",
  mentions_signoffs: "Only when someone @mentions me, and sign-offs",
  none: "No review e-mail",
};
