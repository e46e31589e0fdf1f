/**
 * npm run bench — runs each bench module in order and prints its table. Add a module by adding a line.
 * A bench is not a timed test: a missed target is reported (and sets exit code 1), it does not fail CI.
 */
const benches: [name: string, load: () => Promise<{ run: () => Promise<{ ok: boolean }> }>][] = [
  ["engine", () => import("./engine")],
  ["editor", () => import("./editor")],
  ["open", () => import("./open")],
];

async function main() {
  let allOk = true;
  for (const [name, load] of benches) {
    console.log(`\n== bench: ${name} ==`);
    const { ok } = await (await load()).run();
    allOk &&= ok;
  }
  process.exitCode = allOk ? 0 : 1;
}

main().catch((e) => {
  console.error(e);
  process.exitCode = 1;
});
