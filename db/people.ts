import "server-only";
import type { Person } from "@/shared/schemas/common";

/** How a person whose account is gone is named wherever their work is shown. */
export const FORMER_MEMBER = "former member";

/** The person of a joined users row: `person(r.author_id, r.author_name)`. */
export const person = (id: string | null, name: string | null | undefined): Person => ({ id, name: name ?? FORMER_MEMBER });
/** The name alone (checklist ticks, overview lines). */
export const personName = (name: string | null | undefined) => name ?? FORMER_MEMBER;
