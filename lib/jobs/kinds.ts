import "server-only";
import type { z } from "zod";
import { fieldError, forbidden } from "@/lib/errors";
import type { Build } from "@/db/builds";
import { can, type Role } from "@/shared/roles";
import { getLinkage, getRevision } from "@/db/linkages";
import { LARGE_EXPORT_BYTES, PDF_BYTES_PER_ENTRY, PDF_BYTES_PER_REVISION_PICTURE, exportParams, slug, type ExportKind } from "@/shared/schemas/exports";

/** A failure whose message is for the person who asked (shown on the page and in the e-mail as it is). */
export class ExportFailure extends Error {}

export type RunContext<P> = {
  build: Build;
  params: P;
  /** Fraction done (0–1) and a short note ("1,200 of 5,003 entries"). */
  progress: (fraction: number, note: string) => Promise<void>;
};
/** The file made: in memory (`body`), or on disk (`file`, streamed to storage, then `cleanup`). */
export type ExportResult = { contentType: string; filename: string } & ({ body: Buffer } | { file: string; size: number; cleanup: () => Promise<void> });

type Kind<K extends ExportKind> = {
  /**
   * On the request: checks what the parameters name against the build (a 4xx if not), and returns
   * the job's label and estimated size. Cheap: no export work here.
   */
  prepare: (build: Build, params: z.infer<(typeof exportParams)[K]>, role: Role) => Promise<{ label: string; estimatedBytes: number | null }>;
  /** In the worker process: makes the file. */
  run: (ctx: RunContext<z.infer<(typeof exportParams)[K]>>) => Promise<ExportResult>;
};

const filterLabel = (f: { system?: string; from?: string; to?: string; q?: string }) =>
  [f.from || f.to ? `${f.from ?? "start"} to ${f.to ?? "today"}` : "all entries", f.system, f.q ? `"${f.q}"` : ""].filter(Boolean).join(", ");

/** A log PDF's size before it is made (see shared/exports.ts for the per-item figures). */
export async function estimateLogPdf(buildId: string, f: z.infer<(typeof exportParams)["log-pdf"]>) {
  const { logSize } = await import("@/db/log");
  const s = await logSize(buildId, f);
  const bytes = 40_000 + s.entries * PDF_BYTES_PER_ENTRY + s.photoBytes + s.revisions * PDF_BYTES_PER_REVISION_PICTURE; // 40 kB: the embedded font subsets and first page
  return { ...s, estimatedBytes: bytes, large: bytes > LARGE_EXPORT_BYTES };
}

export const KINDS: { [K in ExportKind]: Kind<K> } = {
  "log-pdf": {
    async prepare(build, f) {
      const e = await estimateLogPdf(build.id, f);
      return { label: `Build log PDF — ${filterLabel(f)} (${e.entries} entr${e.entries === 1 ? "y" : "ies"})`, estimatedBytes: e.estimatedBytes };
    },
    async run({ build, params: f, progress }) {
      const [{ eachEntry, hourTotals, logSize }, { logPdf }] = await Promise.all([import("@/db/log"), import("@/lib/records-pdf")]);
      const [size, totals] = await Promise.all([logSize(build.id, f), hourTotals(build.id, f)]);
      await progress(0, `0 of ${size.entries.toLocaleString("en-US")} entries`);
      const bytes = await logPdf(build, eachEntry(build.id, f), size.entries, totals, f, (done, total) =>
        progress(total ? 0.9 * (done / total) : 0.9, `${done.toLocaleString("en-US")} of ${total.toLocaleString("en-US")} entries laid out`));
      await progress(0.95, "Saving the file");
      return { body: Buffer.from(bytes), contentType: "application/pdf", filename: `${slug(build.name)}-log${f.from ? `-${f.from}` : ""}${f.to ? `-to-${f.to}` : ""}.pdf` };
    },
  },
  "checklist-pdf": {
    async prepare(build, p) {
      const linkage = await getLinkage(build.id, p.linkageId);
      if (!linkage) throw fieldError("params.linkageId", "not a linkage of this build", "That linkage is not in this build.");
      if (p.revision && !(await getRevision(linkage.id, p.revision))) throw fieldError("params.revision", "no such revision", "That linkage has no such revision.");
      return { label: `Checklist PDF — ${linkage.name}, revision ${p.revision ?? linkage.revision}`, estimatedBytes: null };
    },
    async run({ build, params: p, progress }) {
      const [{ listTicks }, { checklistFor }, { checklistReport }, { checklistPdf }] = await Promise.all([import("@/db/checklist"), import("@/shared/records/checklist"), import("@/shared/records/checklist-report"), import("@/lib/records-pdf")]);
      const linkage = await getLinkage(build.id, p.linkageId);
      if (!linkage) throw new ExportFailure("The linkage was deleted before its checklist could be printed.");
      const rev = await getRevision(linkage.id, p.revision);
      if (!rev) throw new ExportFailure(`Revision ${p.revision} of ${linkage.name} no longer exists.`);
      await progress(0.2, "Reading the ticks");
      // The revision's open findings from the report stored with it (as the checklist page shows them), not computed again;
      // its items from the same report as the page's (checklistReport).
      const [{ listAcknowledgements }, { findingStates }, { checklistFindings }] = await Promise.all([import("@/db/acknowledgements"), import("@/shared/review/hazards"), import("@/shared/records/checklist-findings")]);
      const stored = rev.analysis;
      const check = checklistFindings(rev.revision, rev.graph.nodes.length, stored ? findingStates(stored, rev.graph, await listAcknowledgements(linkage.id)) : null);
      const bytes = await checklistPdf(build, linkage, rev.revision, checklistFor(rev.graph, checklistReport(rev, rev.revision === linkage.revision, build.analysisSettings)), await listTicks(linkage.id, rev.revision), check);
      return { body: Buffer.from(bytes), contentType: "application/pdf", filename: `${slug(build.name)}-${slug(linkage.name)}-rev${rev.revision}-checklist.pdf` };
    },
  },
  "hardware-csv": {
    async prepare() {
      return { label: "Hardware list CSV", estimatedBytes: null };
    },
    async run({ build, progress }) {
      const [{ buildHardware }, { hardwareToCsv }] = await Promise.all([import("@/db/hardware"), import("@/shared/records/hardware-csv")]);
      await progress(0.2, "Collecting the hardware of every linkage");
      const csv = hardwareToCsv(await buildHardware(build.id));
      return { body: Buffer.from(csv, "utf8"), contentType: "text/csv; charset=utf-8", filename: `${slug(build.name)}-hardware.csv` };
    },
  },
  "build-archive": {
    async prepare(build, _p, role) {
      if (!can(role, "manage")) throw forbidden("Only the build's owner can export the whole build.");
      const files = await (await import("@/db/files")).countFiles(build.id);
      return { label: `Whole build archive — log, linkages, checklists, ${files.toLocaleString("en-US")} file${files === 1 ? "" : "s"}, hardware list`, estimatedBytes: null };
    },
    async run({ build, progress }) {
      const [{ makeArchive }, { listLinkages }, { serializeLinkage }] = await Promise.all([import("./archive"), import("@/db/linkages"), import("@/shared/linkage/io")]);
      const bodyOf = async (r: ExportResult) => {
        if ("body" in r) return r.body;
        throw new Error("an archive part was made on disk; only in-memory parts are expected here");
      };
      const quiet = async () => {};
      const a = await makeArchive(build, progress, {
        logPdf: async () => bodyOf(await KINDS["log-pdf"].run({ build, params: {}, progress: quiet })),
        hardwareCsv: async () => bodyOf(await KINDS["hardware-csv"].run({ build, params: {}, progress: quiet })),
        linkages: async () => {
          const out = [];
          for (const l of await listLinkages(build.id)) {
            const rev = await getRevision(l.id);
            if (!rev) continue;
            out.push({ name: l.name, file: serializeLinkage(rev.graph), checklistPdf: async () => bodyOf(await KINDS["checklist-pdf"].run({ build, params: { linkageId: l.id, revision: rev.revision }, progress: quiet })) });
          }
          return out;
        },
      });
      return { file: a.file, size: a.size, cleanup: a.cleanup, contentType: "application/x-tar", filename: `${slug(build.name)}-archive-${new Date().toISOString().slice(0, 10)}.tar` };
    },
  },
  "revision-record": {
    async prepare(build, p) {
      const linkage = await getLinkage(build.id, p.linkageId);
      if (!linkage) throw fieldError("params.linkageId", "not a linkage of this build", "That linkage is not in this build.");
      if (!(await getRevision(linkage.id, p.revision))) throw fieldError("params.revision", "no such revision", "That linkage has no such revision.");
      const { signoffOfRevision } = await import("@/db/signoffs");
      if (!(await signoffOfRevision(linkage.id, p.revision, linkage.revision)))
        throw fieldError("params.revision", "not signed off", `Revision ${p.revision} of ${linkage.name} has no sign-off yet: a record is made of a signed-off revision.`);
      return { label: `Revision record PDF — ${linkage.name}, revision ${p.revision}`, estimatedBytes: null };
    },
    async run({ build, params: p, progress }) {
      const [{ signoffOfRevision }, { listAcknowledgements }, { listTicks }, { listJointPhotos, getRevisionPictureRow }, { checklistFor }, { revisionRecordPdf }, { analyze }, { findingStates }, { appUrl }] = await Promise.all([
        import("@/db/signoffs"), import("@/db/acknowledgements"), import("@/db/checklist"), import("@/db/files"), import("@/shared/records/checklist"), import("@/lib/records-pdf"), import("@/shared/analysis"), import("@/shared/review/hazards"), import("@/lib/urls"),
      ]);
      const linkage = await getLinkage(build.id, p.linkageId);
      if (!linkage) throw new ExportFailure("The linkage was deleted before its record could be made.");
      const rev = await getRevision(linkage.id, p.revision);
      if (!rev) throw new ExportFailure(`Revision ${p.revision} of ${linkage.name} no longer exists.`);
      const signoff = await signoffOfRevision(linkage.id, rev.revision, linkage.revision);
      if (!signoff?.fingerprint) throw new ExportFailure(`Revision ${rev.revision} of ${linkage.name} has no sign-off with a fingerprint.`);
      await progress(0.2, "Reading the findings, acknowledgements and ticks");
      const report = rev.analysis ?? analyze(rev.graph, build.analysisSettings);
      const [acks, ticks, photos, picture] = await Promise.all([listAcknowledgements(linkage.id), listTicks(linkage.id, rev.revision), listJointPhotos(build.id, linkage.id), getRevisionPictureRow(build.id, linkage.id, rev.revision)]);
      const keys = await (await import("@/db/files")).fileKeys(build.id, photos.map((x) => x.id));
      await progress(0.4, `Laying out ${rev.graph.joints.length} joints and ${photos.length} photos`);
      const bytes = await revisionRecordPdf({
        build, linkage, revision: rev.revision, graph: rev.graph,
        findings: findingStates(report, rev.graph, acks) as never,
        items: checklistFor(rev.graph, report), ticks,
        photos: photos.filter((x) => x.kind !== "pdf" && keys.has(x.id)).map((x) => ({ jointId: x.jointId, name: x.name, key: keys.get(x.id)!.key, thumbKey: keys.get(x.id)!.thumbKey })),
        picture: picture ? { key: picture.key } : null,
        signoff: { reviewerName: signoff.reviewer.name, statement: signoff.statement, signedAt: signoff.createdAt },
        fingerprint: signoff.fingerprint,
        superseded: rev.revision < linkage.revision ? linkage.revision : null,
        verifyUrl: `${appUrl()}/verify`,
      });
      return { body: Buffer.from(bytes), contentType: "application/pdf", filename: `${slug(build.name)}-${slug(linkage.name)}-rev${rev.revision}-record.pdf` };
    },
  },
};
