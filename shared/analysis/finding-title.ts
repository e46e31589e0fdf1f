/**
 * A finding's short name for people ("Jam nut missing"), from its code ("jam-nut-missing"). Codes are our own
 * kebab-case words chosen to read as a name, so the title is the code in words; the code itself stays in data
 * attributes and the machine fields of exports.
 */
export function findingTitle(code: string): string {
  const words = code.replace(/-/g, " ").trim();
  return words ? words.charAt(0).toUpperCase() + words.slice(1) : "Finding";
}
