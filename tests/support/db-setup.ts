export async function prepareTestDatabase() {
  throw new Error("database set-up is not written yet; run with LW_SKIP_DB=1");
}
