// Prepares the test database and the app server once per vitest run. Engine-only runs may set LW_SKIP_DB=1.
export default async function setup() {
  if (process.env.LW_SKIP_DB === "1") return;
  const { prepareTestDatabase } = await import("./support/db-setup");
  return prepareTestDatabase();
}
