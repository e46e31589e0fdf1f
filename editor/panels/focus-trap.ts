/** Keyboard focus kept inside a modal dialog (the Keys sheet, the conflict dialog). */

/** The controls Tab stops at inside `root`, in order. */
export function tabStops(root: HTMLElement): HTMLElement[] {
  return Array.from(root.querySelectorAll<HTMLElement>("button, [href], input, select, textarea, [tabindex]:not([tabindex='-1'])")).filter((el) => !el.hasAttribute("disabled"));
}

/** On Tab or Shift+Tab at either end of `root` (or from outside it), the focus goes round to the other end. */
export function trapTab(e: Pick<KeyboardEvent, "key" | "shiftKey" | "preventDefault">, root: HTMLElement | null) {
  if (e.key !== "Tab" || !root) return;
  const stops = tabStops(root);
  if (stops.length === 0) return;
  const first = stops[0], last = stops[stops.length - 1];
  const at = document.activeElement;
  if (e.shiftKey ? at === first || !root.contains(at) : at === last || !root.contains(at)) {
    e.preventDefault();
    (e.shiftKey ? last : first).focus();
  }
}
