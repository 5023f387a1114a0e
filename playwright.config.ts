import { defineConfig } from "@playwright/test";

// scripts/test.ts provisions the database and picks free ports; these defaults serve
// `npm run test:e2e` by hand against a database you already migrated and seeded.
const port = Number(process.env.E2E_PORT ?? 3100);
const smtpPort = Number(process.env.MAIL_FAKE_SMTP_PORT ?? 2625);
const mailHttpPort = Number(process.env.MAIL_FAKE_HTTP_PORT ?? 2680);
const baseURL = `http://127.0.0.1:${port}`;
const env = {
  ...(process.env as Record<string, string>),
  APP_URL: baseURL,
  AUTH_URL: `${baseURL}/api/auth`,
  AUTH_SECRET: process.env.AUTH_SECRET ?? "e2e-only-secret-0123456789abcdef",
  SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
  MAIL_FAKE_SMTP_PORT: String(smtpPort),
  MAIL_FAKE_HTTP_PORT: String(mailHttpPort),
  NEXT_TELEMETRY_DISABLED: "1",
};

export default defineConfig({
  testDir: "tests/e2e",
  testMatch: "**/*.spec.ts",
  // Its own sub-folder: Playwright empties outputDir at start, and test-results/ also holds
  // the vitest reports that `npm test` counts.
  outputDir: "test-results/e2e-artifacts",
  fullyParallel: false,
  globalSetup: "./tests/e2e/global-setup.ts",
  workers: 1,
  retries: 0,
  // CI and the team's machines run this on 2 shared cores next to other builds: pages and the
  // worker can take many seconds there (at load 25 a two-user screens test took 3 min, an axe
  // scan 33 s, the first fetch of a sweep page over 15 s). These are safety limits, never speed
  // checks; every wait in the specs is for a condition.
  timeout: 300_000,
  expect: { timeout: 30_000 },
  reporter: [["list"], ["json", { outputFile: process.env.E2E_JSON_REPORT ?? "test-results/e2e.json" }]],
  use: {
    baseURL,
    trace: "retain-on-failure",
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
      args: ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
    },
  },
  metadata: { mailApi: `http://127.0.0.1:${mailHttpPort}/api/messages` },
  webServer: [
    {
      command: "node --import tsx scripts/mail-fake.ts",
      url: `http://127.0.0.1:${mailHttpPort}/api/messages`,
      env,
      reuseExistingServer: false,
      timeout: 120_000,
    },
    {
      // The server `npm start` runs: web processes behind one port (WEB_PROCESSES, default one per core).
      command: `node scripts/web-server.mjs 127.0.0.1 ${port}`,
      url: `${baseURL}/api/health`,
      env: { ...env, NODE_ENV: "production" },
      reuseExistingServer: false,
      timeout: 120_000,
    },
  ],
});
