import { startWorker } from "./boot";

const url = process.env.DATABASE_URL;
if (!url) {
  console.error("worker: DATABASE_URL is not set");
  process.exit(1);
}

// pg-boss lets some of its own writes fail unobserved (marking a job failed while the
// database restarts, say). A lost connection is no reason to die: the job comes back after
// its expiry. Anything else still ends the process, and `npm start` starts a fresh one.
const CONNECTION_LOST = /^(57P|08)|^(ECONNREFUSED|ECONNRESET|EPIPE|ETIMEDOUT)$/;
process.on("unhandledRejection", (reason) => {
  const code = String((reason as { code?: unknown })?.code ?? "");
  const message = reason instanceof Error ? reason.message : String(reason);
  if (CONNECTION_LOST.test(code) || /Connection terminated|timeout exceeded when trying to connect/.test(message)) {
    console.error(`worker ${process.pid}: database unreachable (${message}); carrying on`);
    return;
  }
  console.error(`worker ${process.pid}: unhandled rejection`, reason);
  process.exit(1);
});

try {
  const worker = await startWorker(url, (msg, extra) => console.error(`worker ${process.pid}: ${msg}`, extra ?? ""));
  console.log(`worker ${process.pid}: listening for jobs`);
  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    // Finishes the job in hand, or hands its unfinished scenarios back to the queue; short
    // enough that `npm start` stops within its 15 s (it kills the worker after 8 s).
    await worker.stop({ graceful: true, timeoutMs: 6_000 }).catch((err: Error) => console.error(`worker ${process.pid}: stop: ${err.message}`));
    process.exit(0);
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
  process.on("SIGHUP", stop);
} catch (err) {
  console.error("worker: failed to start", err);
  process.exit(1);
}
