/** Saving a file the editor made (picture, linkage file) to the person's computer. Small: no drawing library here. */
export function downloadBlob(blob: Blob, filename: string) {
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = filename;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

export function fileSafe(name: string): string {
  return name.replace(/[^A-Za-z0-9._-]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 60) || "linkage";
}

/**
 * A picture's file name: the build, the linkage and the revision — the build's name once, when the linkage's
 * name already starts with it ("Larkspur LX-2 pitch" of "Larkspur LX-2": Larkspur-LX-2-pitch-r1.png).
 */
export function pictureFileName(buildName: string, linkageName: string, revision: number): string {
  const build = fileSafe(buildName), linkage = fileSafe(linkageName);
  const lower = linkage.toLowerCase(), b = build.toLowerCase();
  const named = lower === b || lower.startsWith(`${b}-`) ? linkage : `${build}-${linkage}`;
  return `${named}-r${revision}.png`;
}
