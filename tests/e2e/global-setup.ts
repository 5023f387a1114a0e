import { spawn } from "node:child_process";

/** Starts one real worker process for the browser and API tests; returns its teardown. */
export default async function globalSetup(): Promise<() => Promise<void>> {
  const child = spawn(process.execPath, ["--import", "tsx", "worker/index.ts"], {
    env: { ...process.env, SMTP_URL: `smtp://127.0.0.1:${process.env.MAIL_FAKE_SMTP_PORT ?? 2625}`, APP_URL: `http://127.0.0.1:${process.env.E2E_PORT ?? 3100}` },
    stdio: ["ignore", "pipe", "inherit"],
  });
  // On a loaded machine compiling the worker and preparing the queues can take a minute.
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => {
      child.kill("SIGTERM");
      reject(new Error("worker did not start within 120 s"));
    }, 120_000);
    let out: string | null = "";
    child.stdout!.on("data", (d: Buffer) => {
      if (out === null) return;
      out += d.toString();
      if (out.includes("listening for jobs")) {
        out = null;
        clearTimeout(timer);
        resolve();
      }
    });
    child.on("exit", (code) => reject(new Error(`worker exited with ${code}`)));
  });
  return async () => {
    await new Promise((resolve) => {
      child.once("exit", resolve);
      child.kill("SIGTERM");
    });
  };
}
