/** Fixtures for the review tests: revisions written straight to the database, messages read from the mail sink. */
import { existsSync, readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { testDb } from "./db";
import { analyze } from "@/shared/analysis";
import type { LinkageGraph } from "@/shared/linkage/schema";

/** Appends a revision (with its analysis) and makes it current; returns its number. */
export async function addRevision(linkageId: string, graph: LinkageGraph, authorId: string | null = null) {
  const l = await testDb("linkages").where({ id: linkageId }).first("current_revision");
  const revision = l.current_revision + 1;
  await testDb("linkage_revisions").insert({ linkage_id: linkageId, revision, graph: JSON.stringify(graph), analysis: JSON.stringify(analyze(graph)), author_id: authorId });
  await testDb("linkages").where({ id: linkageId }).update({ current_revision: revision });
  return revision;
}

export const MAIL_SINK = path.resolve(__dirname, "../../.data/mail-sink-test");
export type SinkMessage = { id: string; to: string[]; subject: string | null; text: string | null; html: string | null; receivedAt: string };

export function sinkMessages(): SinkMessage[] {
  if (!existsSync(MAIL_SINK)) return [];
  return readdirSync(MAIL_SINK)
    .filter((f) => f.endsWith(".json"))
    .sort()
    .map((f) => {
      try { return JSON.parse(readFileSync(path.join(MAIL_SINK, f), "utf8")) as SinkMessage; } catch { return null; }
    })
    .filter((m): m is SinkMessage => !!m);
}

/** Messages to this address (the sink writes each one when the SMTP transaction ends; wait a little). */
export async function mailTo(address: string, { min = 1, ms = 5000 } = {}) {
  const until = Date.now() + ms;
  for (;;) {
    const got = sinkMessages().filter((m) => m.to.map((t) => t.toLowerCase()).includes(address.toLowerCase()));
    if (got.length >= min || Date.now() > until) return got;
    await new Promise((r) => setTimeout(r, 100));
  }
}
