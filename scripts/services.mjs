// Local stand-ins for hosted services (filled in by the issues that need them).
export async function startLocalServices(_env) {
  return { env: {}, summary: "", async stop() {} };
}
