import path from "node:path";
import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

const here = path.dirname(fileURLToPath(import.meta.url));

export default defineConfig({
  resolve: {
    tsconfigPaths: true,
    // db/ and lib/ modules guard against reaching the browser; tests run them in Node on purpose.
    alias: { "server-only": path.resolve(here, "tests/support/empty.ts") },
  },
  test: {
    include: ["tests/**/*.test.ts"],
    environment: "node",
    testTimeout: 60_000,
    hookTimeout: 180_000,
    fileParallelism: false,
    globalSetup: ["tests/global-setup.ts"],
  },
});
