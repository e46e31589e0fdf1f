import { withUser, parseBody, json } from "@/lib/http";
import { buildInput } from "@/shared/schemas/builds";
import { createBuild, listBuildsForUser } from "@/db/builds";

export const GET = withUser(async ({ user }) => json({ builds: await listBuildsForUser(user.id) }));

export const POST = withUser(async ({ req, user }) => {
  const body = await parseBody(req, buildInput);
  return json({ build: await createBuild(user.id, body) }, 201);
});
