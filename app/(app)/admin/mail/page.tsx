import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { existsSync, readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { requirePageUser } from "@/lib/page-access";
import { Card, EmptyState, Main } from "@/components/ui";
import { LinkifiedText } from "@/components/review/LinkifiedText";

export const metadata: Metadata = { title: "Mail sink" };
export const dynamic = "force-dynamic";

type Message = { id: string; receivedAt: string; from: string | null; to: string[]; subject: string | null; text: string | null };

/** Newest first, at most `limit` (with how many there are in all); unreadable files are skipped. */
function readSink(dir: string, limit = 100): { total: number; messages: Message[] } {
  if (!existsSync(dir)) return { total: 0, messages: [] };
  const files = readdirSync(dir).filter((f) => f.endsWith(".json"));
  const messages = files
    .sort()
    .reverse()
    .slice(0, limit)
    .flatMap((f) => {
      try {
        const m = JSON.parse(readFileSync(path.join(dir, f), "utf8"));
        return [{ id: String(m.id), receivedAt: String(m.receivedAt), from: m.from ?? null, to: Array.isArray(m.to) ? m.to.map(String) : [], subject: m.subject ?? null, text: m.text ?? null }];
      } catch {
        return [];
      }
    });
  return { total: files.length, messages };
}

/**
 * For the site admin in dev and test: what the local SMTP sink received (LW_MAIL_SINK_DIR).
 * Bodies are shown as plain text only; the HTML part is never rendered here.
 */
export default async function MailSinkPage() {
  const me = await requirePageUser("/admin/mail");
  if (!me.isSiteAdmin) notFound();
  const dir = process.env.LW_MAIL_SINK_DIR;
  const { total, messages } = dir ? readSink(dir) : { total: 0, messages: [] };
  return (
    <Main className="mx-auto max-w-4xl space-y-4 p-6">
      <h1 className="text-lg font-semibold">Mail sink</h1>
      {!dir ? (
        <EmptyState title="No local mail sink">
          This server sends e-mail through the SMTP server in SMTP_URL, so there is nothing to list here. The sink runs with <code>npm start</code> and the tests.
        </EmptyState>
      ) : messages.length === 0 ? (
        <EmptyState title="Nothing received yet">Messages the app sends appear here (kept in {dir}).</EmptyState>
      ) : (
        <>
          <p className="text-ink-soft">
            {total > messages.length ? `The newest ${messages.length} of ${total} messages` : `${messages.length} message${messages.length === 1 ? "" : "s"}`} received by the local sink, newest first.
            {total > messages.length ? ` The older ones are the files in ${dir}.` : ""}
          </p>
          <ul className="space-y-3" data-testid="mail-sink-list">
            {messages.map((m) => (
              <li key={m.id} data-testid="mail-sink-item">
                <Card title={m.subject ?? "(no subject)"}>
                  <p className="text-xs text-ink-soft">
                    To {m.to.join(", ")} · {new Date(m.receivedAt).toLocaleString("en-CA")}
                  </p>
                  <details className="mt-2">
                    <summary className="cursor-pointer text-xs text-advisory">Show the text</summary>
                    <LinkifiedText text={m.text ?? ""} className="mt-2 font-mono text-xs" />
                  </details>
                </Card>
              </li>
            ))}
          </ul>
        </>
      )}
    </Main>
  );
}
