/** Which review e-mail a member gets, and how each choice reads (the API checks it in shared/schemas/users.ts). */
export const NOTIFY_PREFS = ["all", "mentions_signoffs", "none"] as const;
export type NotifyPref = (typeof NOTIFY_PREFS)[number];
export const NOTIFY_LABEL: Record<NotifyPref, string> = {
  all: "Every comment and reply on linkages I follow, and sign-offs",
  mentions_signoffs: "Only when someone @mentions me, and sign-offs",
  none: "No review e-mail",
};
/** The choice as a select's option: short enough to show whole in the editor's side panel (360 px at 12 px text). */
export const NOTIFY_SHORT: Record<NotifyPref, string> = {
  all: "Every comment, reply and sign-off",
  mentions_signoffs: "Only @mentions and sign-offs",
  none: "No review e-mail",
};
