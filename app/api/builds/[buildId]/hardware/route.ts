import { withBuild, parseBody, json } from "@/lib/http";
import { buildHardware, listedHardware, setHardwareState } from "@/db/hardware";
import { hardwareQuery, hardwareStatePut, USED_IN_SHOWN } from "@/shared/schemas/hardware";
import { fieldError, notFound } from "@/lib/errors";

/**
 * Every part the joint cards of the current revisions call for, with quantities, state and where used (the
 * first few places of each line and their count); `?line=KEY` answers that one line with every place.
 */
export const GET = withBuild("read", async ({ req, build }) => {
  const q = hardwareQuery.safeParse(Object.fromEntries(req.nextUrl.searchParams));
  if (!q.success) throw fieldError("line", q.error.issues[0]?.message ?? "not a hardware line's key", "The hardware list was asked for a line it cannot read.");
  const lines = await buildHardware(build.id);
  if (q.data.line === undefined) return json({ lines: listedHardware(lines, USED_IN_SHOWN) });
  const line = lines.find((l) => l.key === q.data.line);
  if (!line) throw notFound("hardware line");
  return json({ lines: [line] });
});

/** Set the state of one line (`{key, state}`). */
export const PUT = withBuild("edit", async ({ req, user, build }) => {
  const { key, state } = await parseBody(req, hardwareStatePut);
  const lines = await buildHardware(build.id);
  if (!lines.some((l) => l.key === key)) throw notFound("hardware line");
  await setHardwareState(build.id, key, state, user.id);
  return json({ key, state });
});
