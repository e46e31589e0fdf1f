import "server-only";
/**
 * The whole build as one archive the owner can keep (export kind "build-archive"): the build log as a PDF,
 * every linkage's current revision as a linkage file and its checklist as a PDF, every stored file (photos,
 * documents, revision pictures) as uploaded, the hardware list as CSV, and a README of what is where with
 * the caution. Made in a temporary folder one file at a time (photos are streamed from storage to disk, never
 * held together in memory), then packed as a tar and streamed to storage by the worker.
 */
import { createWriteStream } from "node:fs";
import { mkdir, mkdtemp, rm, stat, writeFile } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import * as tar from "tar";
import type { Build } from "@/db/builds";
import { countFiles, eachFileOldestFirst } from "@/db/files";
import { slug } from "@/shared/schemas/exports";
import { CAUTION_TEXT } from "@/shared/caution";
import type { RunContext } from "./kinds";

/** A file name safe in any archive tool: no folders, no control characters, at most 120 characters. */
const safeName = (s: string) => s.replace(/[\u0000-\u001f\u007f/\\:*?"<>|]+/g, "_").replace(/^\.+/, "_").slice(0, 120) || "file";

export type ArchiveFile = { file: string; size: number; cleanup: () => Promise<void> };

export async function makeArchive(build: Build, progress: RunContext<unknown>["progress"], parts: {
  logPdf: () => Promise<Buffer>; hardwareCsv: () => Promise<Buffer>; linkages: () => Promise<{ name: string; file: string; checklistPdf: () => Promise<Buffer> }[]>;
}): Promise<ArchiveFile> {
  const { getObjectStream } = await import("@/lib/storage");
  const work = await mkdtemp(path.join(os.tmpdir(), "linkwright-archive-"));
  const root = path.join(work, slug(build.name));
  const cleanup = () => rm(work, { recursive: true, force: true });
  try {
    await mkdir(path.join(root, "linkages"), { recursive: true });
    await mkdir(path.join(root, "files"), { recursive: true });
    await progress(0.02, "Reading the build's files");
    const total = await countFiles(build.id);

    await progress(0.05, "Laying out the build log");
    await writeFile(path.join(root, "build-log.pdf"), await parts.logPdf());
    await progress(0.25, "Collecting the hardware list");
    await writeFile(path.join(root, "hardware-list.csv"), await parts.hardwareCsv());

    const linkages = await parts.linkages();
    for (const [i, l] of linkages.entries()) {
      await progress(0.3 + 0.1 * (i / Math.max(1, linkages.length)), `Linkage ${i + 1} of ${linkages.length}: ${l.name}`);
      const base = safeName(slug(l.name));
      await writeFile(path.join(root, "linkages", `${base}.linkage.json`), l.file);
      await writeFile(path.join(root, "linkages", `${base}-checklist.pdf`), await l.checklistPdf());
    }

    // Every stored file, oldest first, a page of rows at a time; two files of the same name both kept.
    const used = new Set<string>();
    let done = 0, missing = 0;
    for await (const rows of eachFileOldestFirst(build.id)) {
      for (const r of rows) {
        let name = `${r.created_at.toISOString().slice(0, 10)}-${safeName(r.name)}`;
        if (used.has(name)) name = `${r.created_at.toISOString().slice(0, 10)}-${r.id.slice(0, 8)}-${safeName(r.name)}`;
        used.add(name);
        const obj = await getObjectStream(r.key);
        if (!obj) missing++;
        else await pipeline(Readable.fromWeb(obj.body as never), createWriteStream(path.join(root, "files", name)));
        done++;
        if (done % 20 === 0 || done === total) await progress(0.4 + 0.5 * (done / Math.max(1, total)), `${done.toLocaleString("en-US")} of ${total.toLocaleString("en-US")} files`);
      }
    }

    await writeFile(path.join(root, "README.txt"), [
      `${build.name} — the build's record from Linkwright, made ${new Date().toISOString().slice(0, 16).replace("T", " ")} UTC.`,
      "",
      "build-log.pdf         every log entry with its photos and the findings of tied revisions",
      "hardware-list.csv     every part the joint cards call for, with quantities, state and where used",
      `linkages/             each linkage's current revision as a linkage file (open it with Import a file) and its checklist (${linkages.length} linkage${linkages.length === 1 ? "" : "s"})`,
      `files/                every uploaded photo and document as uploaded, dated (${done - missing} file${done - missing === 1 ? "" : "s"})`,
      ...(missing ? [`                      ${missing} file${missing === 1 ? " was" : "s were"} missing from storage when this archive was made and ${missing === 1 ? "is" : "are"} not in it.`] : []),
      "",
      CAUTION_TEXT,
      "",
    ].join("\n"));

    await progress(0.92, "Packing the archive");
    const file = path.join(work, `${slug(build.name)}.tar`);
    await tar.c({ file, cwd: work, portable: true }, [path.basename(root)]);
    return { file, size: (await stat(file)).size, cleanup };
  } catch (e) {
    await cleanup();
    throw e;
  }
}
