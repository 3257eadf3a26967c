import { fileURLToPath } from "node:url";
import { defineConfig, type TestProjectInlineConfiguration } from "vitest/config";

function integration(name: string, writer: "native" | "client"): TestProjectInlineConfiguration {
  return {
    extends: true,
    test: {
      name,
      environment: "node",
      include: ["tests/integration/**/*.test.ts"],
      setupFiles: ["tests/integration/setup.ts"],
      testTimeout: 30_000,
      env: { DATABASE_WRITER: writer },
    },
  };
}

export default defineConfig({
  // Tests import server modules directly; outside Next's server bundles the marker would throw.
  resolve: {
    tsconfigPaths: true,
    alias: { "server-only": fileURLToPath(new URL("node_modules/server-only/empty.js", import.meta.url)) },
  },
  test: {
    projects: [
      {
        extends: true,
        test: { name: "unit", environment: "node", include: ["tests/unit/**/*.test.ts"] },
      },
      integration("integration", "native"),
      // The same tests with every transaction through @libsql/client, as with a libSQL server URL.
      integration("integration-client", "client"),
      {
        // The attacks as a suite, against the production build with the demo seeded (like the
        // browser tests, without a browser): a few minutes on two cores. The faults (tests/faults)
        // start, kill and restart production servers of their own on databases of their own.
        extends: true,
        test: {
          name: "security",
          environment: "node",
          include: ["tests/security/**/*.test.ts", "tests/faults/**/*.test.ts"],
          globalSetup: ["tests/e2e/global-setup.ts"],
          setupFiles: ["tests/security/setup.ts"],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
      {
        extends: true,
        test: {
          name: "browser",
          environment: "node",
          include: ["tests/e2e/**/*.test.ts"],
          globalSetup: ["tests/e2e/global-setup.ts"],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
