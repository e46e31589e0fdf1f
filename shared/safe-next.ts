/**
 * Where to go after signing in or up: only a path on this site. Anything a browser could read as another
 * origin — `//evil`, `/\evil` (browsers turn a backslash into a slash), a path with a tab or newline
 * (`/%09/evil` arrives decoded: browsers drop them, which can leave `//evil`), an absolute URL, a
 * `javascript:` URL — sends the person to the builds list instead.
 */
export const NEXT_FALLBACK = "/builds";

export function safeNext(next: string | string[] | undefined | null): string {
  if (typeof next !== "string" || next.length === 0 || next.length > 2000) return NEXT_FALLBACK;
  if (next[0] !== "/") return NEXT_FALLBACK;
  if (next[1] === "/" || next[1] === "\\") return NEXT_FALLBACK;
  if (/[\u0000-\u001f\u007f\\]/.test(next)) return NEXT_FALLBACK; // control characters, and backslashes anywhere
  try {
    const base = "http://same.invalid";
    const u = new URL(next, base);
    if (u.origin !== base) return NEXT_FALLBACK;
    return `${u.pathname}${u.search}${u.hash}`;
  } catch {
    return NEXT_FALLBACK;
  }
}
