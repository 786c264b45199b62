import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";

const sharedDir = fileURLToPath(new URL("./shared", import.meta.url));
const apiPort = Number(process.env.PORT ?? 5180);

export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: { alias: { "@shared": sharedDir } },
  server: {
    host: "127.0.0.1",
    port: Number(process.env.VITE_PORT ?? 5173),
    proxy: { "/api": { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false } },
  },
  build: {
    outDir: "dist/client",
    emptyOutDir: true,
    chunkSizeWarningLimit: 1500,
  },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: "unit",
          include: ["tests/physics/**/*.test.ts", "tests/unit/**/*.test.ts"],
          environment: "node",
        },
      },
      {
        extends: true,
        test: {
          name: "api",
          include: ["tests/api/**/*.test.ts"],
          environment: "node",
          globalSetup: ["tests/support/globalSetup.ts"],
          setupFiles: ["tests/support/setupEnv.ts"],
          testTimeout: 30000,
          hookTimeout: 60000,
          fileParallelism: false,
        },
      },
      {
        extends: true,
        test: {
          // Browser journeys against the real server (playwright-core + Debian chromium); scripts/test.sh runs them last.
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          environment: "node",
          globalSetup: ["tests/e2e/support/globalSetup.ts"],
          testTimeout: 120000,
          hookTimeout: 300000,
          fileParallelism: false,
        },
      },
    ],
  },
});
