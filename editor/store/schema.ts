/**
 * The graph schema (zod, shared/linkage/schema.ts), loaded on first use: the editor draws, selects, moves,
 * joins and adds parts without it (shared/linkage/kinds and format.ts), and needs it only to check what a
 * person typed into a card (the cards load it before they show, Inspector.tsx) or an imported file. Keeping
 * it out of the editor's first chunks keeps the schema library out of the first load (`npm run bench:open`).
 */
type Schema = typeof import("@/shared/linkage/schema");

let schema: Schema | null = null;
let loading: Promise<Schema> | null = null;

/** Load the schema (once); resolves with it. */
export function loadSchema(): Promise<Schema> {
  loading ??= import("@/shared/linkage/schema").then((m) => (schema = m), (e) => { loading = null; throw e; });
  return loading;
}

/** The schema if it has loaded, else null (and it starts loading). */
export function schemaNow(): Schema | null {
  if (!schema) void loadSchema().catch(() => {});
  return schema;
}

/** What an edit answers while the schema is still on its way (the card is not shown before it has loaded). */
export const SCHEMA_LOADING = "The part checks are still loading; try again in a moment.";
