/**
 * What the editor draws and asks for each part kind: its glyph (a small line drawing made for Linkwright),
 * the key-number lines of its card (also drawn by the picture export) and the fields of its properties form.
 * One file per kind beside this one, collected in index.ts; the shared half of a kind is shared/linkage/kinds/.
 */
import type { ReactNode } from "react";
import type { NodeKind, PropsOf } from "@/shared/linkage/kinds";
import type { ControlSystem } from "@/shared/linkage/schema";
import type { FieldSpec } from "../../panels/SchemaForm";
import type { UnitSystem } from "../../units";

export type EditorKindDef<K extends NodeKind = NodeKind> = {
  kind: K;
  /** Drawn in a 20 × 20 view box with `currentColor` strokes. */
  glyph: ReactNode;
  /** The card's key-number lines under the title. Their count must not depend on the unit system or the run's system. */
  lines: (props: PropsOf<K>, u: UnitSystem, system: ControlSystem) => string[];
  /** The "Dimensions" section of the properties form (paths `props.<field>`), or its fields for the run's system. */
  fields: FieldSpec[] | ((system: ControlSystem) => FieldSpec[]);
};

/** A kind's form fields in a run of `system`. */
export function kindFields(def: EditorKindDef, system: ControlSystem): FieldSpec[] {
  return typeof def.fields === "function" ? def.fields(system) : def.fields;
}

export function defineEditorKind<const K extends NodeKind>(def: EditorKindDef<K>): EditorKindDef<K> {
  return def;
}
