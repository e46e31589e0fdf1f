"use client";
/**
 * The offer of a return cable, on the card of a cable joined at both ends with no return yet and on the card
 * of the joint that was just drawn to it: one click (or R) makes the second cable of the circuit.
 */
import { useEditorConfig, useEditorStoreApi, useEditorValue } from "../context";
import { returnableCable } from "../store/cable";

export function ReturnCableOffer() {
  const api = useEditorStoreApi();
  const { readOnly } = useEditorConfig();
  const cable = useEditorValue((s) => returnableCable(s));
  const name = useEditorValue((s) => (cable ? s.nodes.find((n) => n.id === cable)?.label || "This cable" : ""));
  if (!cable || readOnly) return null;
  return (
    <div className="rounded border border-caution/30 bg-caution/5 px-2 py-1.5 text-[11px]" data-testid="return-cable-offer" data-cable={cable}>
      <p className="text-ink">
        {name} only pulls. Close the circuit with a return cable between the same two parts, so the control works both ways.
      </p>
      <button type="button" className="mt-1 min-h-8 rounded bg-ink px-2 py-1 text-[12px] font-medium text-white hover:bg-ink/90" data-testid="btn-return-cable"
        aria-keyshortcuts="R" onClick={() => api.getState().addReturnCable(cable)}>
        Add the return cable <kbd className="ml-1 rounded bg-white/20 px-1 text-[10px]">R</kbd>
      </button>
    </div>
  );
}
