/**
 * A long build for the paging tests and `npm run bench:scale`, inserted in bulk (batches of rows, many
 * objects stored at once) so even the bench's ten-year build seeds in a minute or two: log entries
 * spread over the years with small real JPEG photos (original and thumbnail) in the S3 fake, linkages
 * with many revisions, comments, sign-offs and a parts library. Invented data throughout.
 */
import { randomUUID } from "node:crypto";
import type { Knex } from "knex";
import { S3Client, PutObjectCommand } from "@aws-sdk/client-s3";
import { demoPitchLinkage } from "@/shared/demo";
import { analyze } from "@/shared/analysis";

export type LongBuildSize = { entries: number; years: number; photosPerEntry: number; linkages: number; revisions: number; comments: number; signoffs: number; parts: number };
export const BENCH_SIZE: LongBuildSize = { entries: 5000, years: 8, photosPerEntry: 3, linkages: 12, revisions: 500, comments: 3000, signoffs: 200, parts: 2000 };

const SYSTEMS = ["pitch", "roll", "yaw", "flap", "trim", "other"] as const;
const WORDS = "drilled reamed deburred primed riveted fitted torqued safety-wired inspected measured trimmed bent fabricated sanded cleaned aligned shimmed".split(" ");
const PARTS = "pushrod bellcrank horn bracket rod-end bushing cable turnbuckle pulley stop spar rib skin hinge torque-tube".split(" ");

async function inBatches<T>(rows: T[], size: number, fn: (batch: T[]) => Promise<unknown>) {
  for (let i = 0; i < rows.length; i += size) await fn(rows.slice(i, i + size));
}
async function pool<T>(items: T[], n: number, fn: (t: T) => Promise<unknown>) {
  let next = 0;
  await Promise.all(Array.from({ length: n }, async () => { while (next < items.length) await fn(items[next++]); }));
}

/** A few distinct small real JPEGs (a photo-like gradient with shapes), each with its 320 px thumbnail. */
async function samplePhotos(n: number) {
  const sharp = (await import("sharp")).default;
  const out: { original: Buffer; thumb: Buffer }[] = [];
  for (let i = 0; i < n; i++) {
    const hue = (i * 47) % 360;
    const svg = Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" width="640" height="480"><defs><linearGradient id="g" x1="0" y1="0" x2="1" y2="1"><stop offset="0" stop-color="hsl(${hue},35%,70%)"/><stop offset="1" stop-color="hsl(${(hue + 60) % 360},30%,30%)"/></linearGradient></defs><rect width="640" height="480" fill="url(#g)"/><circle cx="${200 + i * 13}" cy="220" r="90" fill="#ddd" opacity="0.7"/><rect x="360" y="${120 + i * 7}" width="180" height="60" fill="#333" opacity="0.6"/><text x="40" y="440" font-size="36" fill="#fff">part ${i + 1}</text></svg>`);
    const original = await sharp(svg).jpeg({ quality: 80 }).toBuffer();
    const thumb = await sharp(original).resize(320, 320, { fit: "inside" }).jpeg({ quality: 78 }).toBuffer();
    out.push({ original, thumb });
  }
  return out;
}

export async function seedLongBuild(db: Knex, s3: { client: S3Client; bucket: string }, o: { buildId: string; ownerId: string; reviewerId?: string; size: LongBuildSize; log?: (s: string) => void }) {
  const { size, buildId, ownerId } = o;
  const log = o.log ?? (() => {});
  const graph = demoPitchLinkage();
  const analysis = JSON.stringify(analyze(graph));
  const graphJson = JSON.stringify(graph);

  log(`${size.linkages} linkages × ${size.revisions} revisions`);
  const linkages = Array.from({ length: size.linkages }, (_, i) => ({ id: randomUUID(), build_id: buildId, name: `Run ${String(i + 1).padStart(2, "0")} — ${SYSTEMS[i % 6]}`, system: SYSTEMS[i % 6], current_revision: size.revisions }));
  await db("linkages").insert(linkages);
  const start = Date.now() - size.years * 365.25 * 86_400_000;
  for (const l of linkages) {
    const revs = Array.from({ length: size.revisions }, (_, r) => ({ linkage_id: l.id, revision: r + 1, graph: graphJson, analysis, author_id: ownerId, created_at: new Date(start + ((r + 1) / size.revisions) * (Date.now() - start)) }));
    await inBatches(revs, 250, (b) => db("linkage_revisions").insert(b));
  }

  log(`${size.entries} log entries over ${size.years} years, ${size.photosPerEntry} photos each`);
  const photos = await samplePhotos(6);
  const entries = Array.from({ length: size.entries }, (_, i) => {
    const t = start + (i / size.entries) * (Date.now() - start);
    const tied = i % 25 === 0 ? linkages[i % linkages.length] : null;
    return {
      id: randomUUID(), build_id: buildId, date: new Date(t).toISOString().slice(0, 10), hours: 0.5 + (i % 8) * 0.25,
      title: `Entry ${i + 1}: ${WORDS[i % WORDS.length]} the ${PARTS[(i * 7) % PARTS.length]}`,
      text: `Session ${i + 1}. ${Array.from({ length: 3 + (i % 5) }, (_, k) => `${WORDS[(i + k) % WORDS.length]} the ${PARTS[(i + k * 3) % PARTS.length]}`).join(", ")}. Checked against the drawings; no deviations.`,
      systems: [SYSTEMS[i % 6], ...(i % 4 === 0 ? [SYSTEMS[(i + 1) % 6]] : [])], author_id: ownerId,
      linkage_id: tied?.id ?? null, revision: tied ? 1 + (i % size.revisions) : null, created_at: new Date(t),
    };
  });
  await inBatches(entries, 500, (b) => db("log_entries").insert(b));

  const files: Record<string, unknown>[] = [];
  const thumbs: Record<string, unknown>[] = [];
  const links: Record<string, unknown>[] = [];
  const objects: { key: string; body: Buffer; type: string }[] = [];
  entries.forEach((e, i) => {
    for (let k = 0; k < size.photosPerEntry; k++) {
      const id = randomUUID();
      const p = photos[(i + k) % photos.length];
      const key = `builds/${buildId}/files/${id}.jpg`;
      const thumbKey = `builds/${buildId}/thumbs/${id}.jpg`;
      objects.push({ key, body: p.original, type: "image/jpeg" }, { key: thumbKey, body: p.thumb, type: "image/jpeg" });
      files.push({ id, build_id: buildId, key, kind: "photo", content_type: "image/jpeg", size: p.original.length, name: `photo-${i + 1}-${k + 1}.jpg`, thumb_key: thumbKey, thumb_size: p.thumb.length, width: 640, height: 480, uploaded_by: ownerId, created_at: new Date((e.created_at as Date).getTime() + k) });
      thumbs.push({ file_id: id, bytes: p.thumb });
      links.push({ entry_id: e.id, file_id: id, position: k });
    }
  });
  if (objects.length) {
    log(`${objects.length} objects into the S3 fake`);
    await pool(objects, 24, (x) => s3.client.send(new PutObjectCommand({ Bucket: s3.bucket, Key: x.key, Body: x.body, ContentType: x.type })));
  }
  await inBatches(files, 1000, (b) => db("files").insert(b));
  await inBatches(thumbs, 1000, (b) => db("file_thumbnails").insert(b));
  await inBatches(links, 2000, (b) => db("log_entry_files").insert(b));

  log(`${size.comments} comments, ${size.signoffs} sign-offs, ${size.parts} parts`);
  const comments = Array.from({ length: size.comments }, (_, i) => ({
    build_id: buildId, linkage_id: linkages[i % linkages.length].id, subject_type: "joint", subject_id: "j-stick-fwd", author_id: ownerId,
    body: `Comment ${i + 1}: is the ${PARTS[i % PARTS.length]} ${WORDS[i % WORDS.length]}?`, revision: 1 + (i % size.revisions), created_at: new Date(start + (i / Math.max(1, size.comments)) * (Date.now() - start)),
  }));
  await inBatches(comments, 1000, (b) => db("comments").insert(b));
  const signoffs = Array.from({ length: size.signoffs }, (_, i) => ({ linkage_id: linkages[i % linkages.length].id, revision: 1 + ((i * 37) % size.revisions), reviewer_id: o.reviewerId ?? ownerId, statement: `Inspected revision at sign-off ${i + 1}.`, stale_notified_at: new Date() }));
  await inBatches(signoffs, 1000, (b) => db("signoffs").insert(b));
  const parts = Array.from({ length: size.parts }, (_, i) => ({
    build_id: buildId, kind: "rodEnd", part_number: `LB-RE-${String(i + 1).padStart(5, "0")}`, description: `Invented rod end ${i + 1} (no real rating)`,
    spec: JSON.stringify({ thread: "1/4-28", hand: i % 2 ? "LH" : "RH", shank: "male", ballBore: 0.25, ballDiameter: 0.5, housingBore: 0.5, ratedUltimate: 3000 + (i % 50) * 20, ratedMisalignment: 10, hasWitnessHole: true }),
  }));
  await inBatches(parts, 1000, (b) => db("parts").insert(b));
  return { linkageIds: linkages.map((l) => l.id), entryIds: entries.map((e) => e.id), objectKeys: objects.map((x) => x.key) };
}
