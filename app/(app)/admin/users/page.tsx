import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requirePageUser } from "@/lib/page-access";
import { listUsersForAdmin } from "@/db/users";
import { Card, Main } from "@/components/ui";
import { AdminToggle } from "./AdminToggle";

export const metadata: Metadata = { title: "Users" };

export default async function AdminUsersPage() {
  const me = await requirePageUser("/admin/users");
  if (!me.isSiteAdmin) notFound();
  const users = await listUsersForAdmin();
  return (
    <Main className="mx-auto max-w-4xl space-y-4 p-6">
      <h1 className="text-xl font-semibold">Users</h1>
      <p className="text-ink-soft">Site admins manage accounts only. They do not see builds unless a build&apos;s owner adds them.</p>
      <Card>
        <div className="table-box">
          <table className="w-full text-left">
            <thead className="text-xs uppercase tracking-wide text-ink-soft"><tr><th className="py-1">Name</th><th>E-mail</th><th>Builds</th><th>Joined</th><th>Site admin</th></tr></thead>
            <tbody>
              {users.map((u) => (
                <tr key={u.id} className="border-t border-ink/10" data-testid="admin-user-row">
                  <td className="py-1.5 font-medium">{u.name}</td>
                  <td className="text-ink-soft">{u.email}</td>
                  <td>{u.builds}</td>
                  <td className="text-xs text-ink-soft">{new Date(u.createdAt).toLocaleDateString("en-CA")}</td>
                  <td><AdminToggle userId={u.id} name={u.name} initial={u.isSiteAdmin} self={u.id === me.id} /></td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </Card>
    </Main>
  );
}
