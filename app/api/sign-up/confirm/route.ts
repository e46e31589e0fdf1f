import { withErrors, parseBody, json } from "@/lib/http";
import { openConfirmLink } from "@/lib/sign-up";
import { signUpConfirm } from "@/shared/schemas/users";

/** The token from the e-mailed link makes the account, once, before it expires; the person then signs in. */
export const POST = withErrors(async ({ req }) => {
  const { token } = await parseBody(req, signUpConfirm);
  return json(await openConfirmLink(token));
});
