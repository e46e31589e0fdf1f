import { withErrors, parseBody, json } from "@/lib/http";
import { requestSignUp } from "@/lib/sign-up";
import { SIGN_UP_SENT, signUpInput } from "@/shared/schemas/users";

/** Always the same answer for a valid request: the e-mail sent to the address says what happens next. */
export const POST = withErrors(async ({ req }) => {
  const body = await parseBody(req, signUpInput);
  await requestSignUp(body);
  return json({ message: SIGN_UP_SENT }, 202);
});
