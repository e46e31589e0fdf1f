import "server-only";
import { db } from "./index";
import { countOf, keysetPage, type Key, type PageArgs } from "./paging";
import type { PartInput } from "@/shared/records/parts";
import type { Part } from "@/shared/schemas/parts";

/** A parts library: a user's own, or a build's. */
export type Library = { userId: string } | { buildId: string };

type PartRow = { id: string; kind: Part["kind"]; part_number: string; description: string; spec: Part["spec"]; created_at: Date; updated_at: Date };
const toPart = (r: PartRow): Part => ({
  id: r.id, kind: r.kind, partNumber: r.part_number, description: r.description, spec: r.spec,
  createdAt: r.created_at.toISOString(), updatedAt: r.updated_at.toISOString(),
});
const owner = (lib: Library) => ("userId" in lib ? { owner_user_id: lib.userId } : { build_id: lib.buildId });

/** Parts newest first (the id breaks ties). */
export const PART_KEYS: Key[] = [{ expr: "p.created_at", type: "timestamptz" }, { expr: "p.id", type: "uuid" }];
export type PartFilter = { q?: string; kind?: Part["kind"] };

/** One page of a library (search and kind run in the database over every part) and how many match. */
export async function pageParts(lib: Library, f: PartFilter, page: PageArgs) {
  const q = () => {
    const b = db("parts as p").where("userId" in lib ? { "p.owner_user_id": lib.userId } : { "p.build_id": lib.buildId });
    if (f.kind) b.where("p.kind", f.kind);
    if (f.q?.trim()) {
      const like = `%${f.q.trim().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
      b.where((w) => w.whereILike("p.part_number", like).orWhereILike("p.description", like));
    }
    return b;
  };
  const [p, total] = await Promise.all([keysetPage<PartRow>(q().select("p.*"), PART_KEYS, page), countOf(q())]);
  return { items: p.items.map(toPart), next: p.next, total };
}

/** Every part (for suggestions and the CSV export). */
export async function listParts(lib: Library) {
  const rows = await db<PartRow>("parts").where(owner(lib)).orderBy(["kind", "part_number"]);
  return rows.map(toPart);
}

export async function partNumbers(lib: Library) {
  return (await db("parts").where(owner(lib)).pluck("part_number")) as string[];
}

const isDuplicate = (e: unknown) => (e as { code?: string }).code === "23505";

/** Returns "duplicate" when the part number is already in the library. */
export async function createPart(lib: Library, p: PartInput) {
  try {
    const [row] = await db<PartRow>("parts")
      .insert({ ...owner(lib), kind: p.kind, part_number: p.partNumber, description: p.description, spec: JSON.stringify(p.spec) as unknown as Part["spec"] })
      .returning("*");
    return toPart(row);
  } catch (e) {
    if (isDuplicate(e)) return "duplicate" as const;
    throw e;
  }
}

export async function updatePart(lib: Library, id: string, p: PartInput) {
  try {
    const [row] = await db<PartRow>("parts")
      .where({ ...owner(lib), id })
      .update({ kind: p.kind, part_number: p.partNumber, description: p.description, spec: JSON.stringify(p.spec) as unknown as Part["spec"], updated_at: db.fn.now() as unknown as Date })
      .returning("*");
    return row ? toPart(row) : null;
  } catch (e) {
    if (isDuplicate(e)) return "duplicate" as const;
    throw e;
  }
}

export async function deletePart(lib: Library, id: string) {
  return (await db("parts").where({ ...owner(lib), id }).del()) > 0;
}

/** All or nothing: one transaction for the whole file. */
export async function importParts(lib: Library, parts: PartInput[]) {
  if (!parts.length) return 0;
  try {
    await db.transaction(async (trx) => {
      for (let i = 0; i < parts.length; i += 500) {
        await trx("parts").insert(parts.slice(i, i + 500).map((p) => ({ ...owner(lib), kind: p.kind, part_number: p.partNumber, description: p.description, spec: JSON.stringify(p.spec) })));
      }
    });
  } catch (e) {
    if (isDuplicate(e)) return "duplicate" as const;
    throw e;
  }
  return parts.length;
}
