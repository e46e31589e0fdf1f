import type { Metadata } from "next";
import { ConfirmSignUp } from "./ConfirmSignUp";

export const metadata: Metadata = { title: "Finish creating your account" };

/** The link from the sign-up e-mail. Opening the page makes the account (the page posts the token), then sign-in. */
export default async function ConfirmSignUpPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return <ConfirmSignUp token={token} />;
}
