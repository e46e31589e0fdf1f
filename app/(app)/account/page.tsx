import type { Metadata } from "next";
import { requirePageUser } from "@/lib/page-access";
import { Card, Main } from "@/components/ui";
import { PasswordForm } from "./PasswordForm";

export const metadata: Metadata = { title: "Your account" };

export default async function AccountPage() {
  const user = await requirePageUser();
  return (
    <Main className="mx-auto max-w-lg space-y-4 p-6">
      <h1 className="text-xl font-semibold">Your account</h1>
      <p className="text-ink-soft">{user.name} · {user.email}</p>
      <Card title="Change your password">
        <PasswordForm />
      </Card>
    </Main>
  );
}
