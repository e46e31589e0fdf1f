/** The small line drawing of a part kind (each kind's own, in editor/nodes/kinds/). */
import type { NodeKind } from "@/shared/linkage/schema";
import { EDITOR_KINDS } from "./kinds";

export function KindGlyph({ kind, className = "h-4 w-4" }: { kind: NodeKind; className?: string }) {
  return (
    <svg viewBox="0 0 20 20" className={className} aria-hidden="true">
      {EDITOR_KINDS[kind]?.glyph}
    </svg>
  );
}
