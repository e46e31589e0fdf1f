/**
 * npm run analyze -- path/to/linkage.json [--settings settings.json]
 * Prints the load-path report as JSON; exits 1 with the errors (path and message) on an invalid file.
 */
import { readFileSync } from "node:fs";
import { parseLinkageFile } from "../shared/linkage/io";
import { analyze, settingsSchema } from "../shared/analysis";

function main(argv: string[]): number {
  const args = argv.filter((a) => a !== "--");
  const si = args.indexOf("--settings");
  const settingsPath = si >= 0 ? args[si + 1] : undefined;
  const file = args.filter((_, i) => si < 0 || (i !== si && i !== si + 1))[0];
  if (!file) {
    process.stderr.write("usage: npm run analyze -- path/to/linkage.json [--settings settings.json]\n");
    return 2;
  }
  let text: string;
  try {
    text = readFileSync(file, "utf8");
  } catch (e) {
    process.stderr.write(`cannot read ${file}: ${(e as Error).message}\n`);
    return 1;
  }
  const parsed = parseLinkageFile(text);
  if (!parsed.ok) {
    process.stderr.write(`${file} is not a valid linkage file:\n`);
    for (const e of parsed.errors) process.stderr.write(`  ${e.path || "(file)"}: ${e.message}\n`);
    process.stdout.write(JSON.stringify({ ok: false, errors: parsed.errors }, null, 2) + "\n");
    return 1;
  }
  let settings;
  if (settingsPath) {
    const r = settingsSchema.safeParse(JSON.parse(readFileSync(settingsPath, "utf8")));
    if (!r.success) {
      process.stderr.write(`${settingsPath}: invalid settings: ${r.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ")}\n`);
      return 1;
    }
    settings = r.data;
  }
  process.stdout.write(JSON.stringify(analyze(parsed.graph, settings), null, 2) + "\n");
  return 0;
}

process.exitCode = main(process.argv.slice(2));
