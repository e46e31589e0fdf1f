import { Main } from "@/components/ui";
import Link from "next/link";
import type { Metadata } from "next";
import { getSessionUser } from "@/lib/auth";
import { findInvitation } from "@/db/builds";
import { ROLE_LABEL } from "@/shared/roles";
import { AcceptInvitation } from "./AcceptInvitation";
import { maskEmail } from "@/shared/schemas/members";

export const metadata: Metadata = { title: "Invitation" };

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const [user, inv] = await Promise.all([getSessionUser(), /^[A-Za-z0-9_-]{20,64}$/.test(token) ? findInvitation(token) : null]);
  const open = inv && !inv.accepted_at && inv.expires_at > new Date();
  const here = `/invite/${token}`;
  return (
    <Main className="mx-auto mt-16 max-w-md rounded-lg border border-ink/10 bg-white p-6">
      <p className="text-lg font-semibold">Linkwright invitation</p>
      {!open ? (
        <p className="mt-2 text-ink-soft">This invitation link has been used, has expired or was withdrawn. Ask the build&apos;s owner for a new one.</p>
      ) : (
        <>
          <p className="mt-2">You are invited to <strong>{inv.build_name}</strong> as <strong>{ROLE_LABEL[inv.role]}</strong>.</p>
          {user && user.email.toLowerCase() !== String(inv.email).toLowerCase() ? (
            <p className="mt-4 rounded bg-caution/10 p-2 text-sm" data-testid="invite-wrong-account">
              This invitation was sent to {maskEmail(String(inv.email))}, and you are signed in as {user.email}. Only the invited
              address can accept it: <Link className="text-advisory underline" href="/sign-out">sign out</Link> and
              sign in (or create an account) with that address, or ask the build&apos;s owner to invite this one.
            </p>
          ) : user ? (
            <AcceptInvitation token={token} signedInAs={user.email} />
          ) : (
            <p className="mt-4 space-x-3">
              <Link className="rounded bg-ink px-3 py-1.5 text-white" href={`/sign-in?next=${encodeURIComponent(here)}`}>Sign in to accept</Link>
              <Link className="text-advisory underline" href={`/sign-up?next=${encodeURIComponent(here)}`}>Create an account</Link>
            </p>
          )}
        </>
      )}
    </Main>
  );
}
