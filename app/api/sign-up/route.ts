import { withErrors, parseBody, json } from "@/lib/http";
import { emailTaken } from "@/lib/errors";
import { signUpInput } from "@/shared/schemas/users";
import { createUser, findUserByEmail } from "@/db/users";
import { hashPassword } from "@/lib/passwords";

export const POST = withErrors(async ({ req }) => {
  const body = await parseBody(req, signUpInput);
  if (await findUserByEmail(body.email)) {
    throw emailTaken("An account with this e-mail already exists. Sign in instead.", { email: "Already registered" });
  }
  const user = await createUser({ email: body.email, name: body.name, passwordHash: await hashPassword(body.password) });
  return json({ user: { id: user.id, email: user.email, name: user.name } }, 201);
});
