import { withBuild, parseBody, json } from "@/lib/http";
import { buildHardware, setHardwareState } from "@/db/hardware";
import { hardwareStatePut } from "@/shared/schemas/hardware";
import { notFound } from "@/lib/errors";
import { audit } from "@/db/audit";

/** Every part the joint cards of the current revisions call for, with quantities, where used and state. */
export const GET = withBuild("read", async ({ build }) => json({ lines: await buildHardware(build.id) }));

/** Set the state of one line (`{key, state}`). */
export const PUT = withBuild("edit", async ({ req, user, build }) => {
  const { key, state } = await parseBody(req, hardwareStatePut);
  const lines = await buildHardware(build.id);
  if (!lines.some((l) => l.key === key)) throw notFound("hardware line");
  await setHardwareState(build.id, key, state, user.id);
  await audit({ buildId: build.id, userId: user.id, action: "hardware.state", detail: { key, state } });
  return json({ key, state });
});
