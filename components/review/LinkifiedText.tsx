/**
 * User text shown as text: line breaks kept, http(s) addresses made into links that open in a new tab
 * without handing the page to the target. Never HTML from the text itself.
 */
const URL_RE = /\bhttps?:\/\/[^\s<>"']+[^\s<>"'.,;:!?)\]]/g;

export function splitLinks(text: string): ({ kind: "text"; value: string } | { kind: "link"; value: string })[] {
  const out: ({ kind: "text"; value: string } | { kind: "link"; value: string })[] = [];
  let last = 0;
  for (const m of text.matchAll(URL_RE)) {
    if ((m.index ?? 0) > last) out.push({ kind: "text", value: text.slice(last, m.index) });
    out.push({ kind: "link", value: m[0] });
    last = (m.index ?? 0) + m[0].length;
  }
  if (last < text.length) out.push({ kind: "text", value: text.slice(last) });
  return out;
}

export function LinkifiedText({ text, className = "" }: { text: string; className?: string }) {
  return (
    <p className={`whitespace-pre-wrap break-words ${className}`}>
      {splitLinks(text).map((p, i) =>
        p.kind === "link" ? (
          <a key={i} href={p.value} target="_blank" rel="noopener noreferrer nofollow" className="text-advisory underline">
            {p.value}
          </a>
        ) : (
          <span key={i}>{p.value}</span>
        ),
      )}
    </p>
  );
}
