import type { Metadata } from "next";
import { SignOutForm } from "./SignOutForm";

export const metadata: Metadata = { title: "Sign out" };

export default function SignOutPage() {
  return <SignOutForm />;
}
