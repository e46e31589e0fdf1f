import "server-only";
import { db } from "./index";
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
