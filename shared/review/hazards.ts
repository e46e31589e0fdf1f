/**
 * Which findings of a revision are covered by an acknowledgement. An acknowledgement covers a finding
 * with the same code and subject while the subject's fingerprint in that revision is still the one
 * recorded when it was written; otherwise it has lapsed.
 */
import type { Finding, Report, Subject } from "../analysis/types";
import type { LinkageGraph } from "../linkage/schema";
import { fingerprint } from "./fingerprint";
import { subjectName } from "../linkage/names";

export type AckLike = { id: string; code: string; subject: Subject; fingerprint: string; createdAt: string };
/** A finding with its subject named (shared/linkage/names.ts) and the acknowledgement that covers it. */
export type FindingState = Finding & { subjectName: string; acknowledgement: AckLike | null; lapsed: AckLike | null };

const sameSubject = (a: Subject, b: Subject) => a.type === b.type && a.id === b.id;

/** The newest acknowledgement of this finding that still matches the subject, and the newest lapsed one. */
export function ackFor(f: Pick<Finding, "code" | "subject">, graph: LinkageGraph, acks: AckLike[]) {
  const mine = acks.filter((a) => a.code === f.code && sameSubject(a.subject, f.subject)).sort((x, y) => y.createdAt.localeCompare(x.createdAt));
  const fp = fingerprint(graph, f.subject);
  const active = mine.find((a) => a.fingerprint === fp) ?? null;
  const lapsed = active ? null : (mine[0] ?? null);
  return { active, lapsed };
}

export function findingStates(report: Report, graph: LinkageGraph, acks: AckLike[]): FindingState[] {
  return report.findings.map((f) => {
    const { active, lapsed } = ackFor(f, graph, acks);
    return { ...f, subjectName: subjectName(graph, f.subject), acknowledgement: active, lapsed };
  });
}

/** Hazards nobody acknowledged for this exact hardware: these block a sign-off. */
export function unacknowledgedHazards(report: Report, graph: LinkageGraph, acks: AckLike[]) {
  return findingStates(report, graph, acks).filter((f) => f.severity === "hazard" && !f.acknowledgement);
}
