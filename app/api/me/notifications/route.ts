import { withUser, parseBody, json } from "@/lib/http";
import { notificationsPatch } from "@/shared/schemas/users";
import { getNotify, setNotify } from "@/db/users";

/** Which review e-mails the signed-in user gets: all | mentions_signoffs | none. */
export const GET = withUser(async ({ user }) => json({ notify: await getNotify(user.id) }));

export const PATCH = withUser(async ({ req, user }) => {
  const body = await parseBody(req, notificationsPatch);
  await setNotify(user.id, body.notify);
  return json({ notify: body.notify });
});
