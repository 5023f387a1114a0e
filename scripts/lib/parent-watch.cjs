// Preloaded (node --require) into every service `npm start` runs. When the orchestrator
// that started this process dies without stopping it (kill -9, a crash), the process is
// re-parented; it then stops itself the ordinary way, so nothing is left running for long.
"use strict";
const expected = Number(process.env.SERIATIM_SUPERVISOR_PID || 0);
if (expected) {
  const timer = setInterval(() => {
    if (process.ppid !== expected) {
      clearInterval(timer);
      process.kill(process.pid, "SIGTERM");
      // A process that ignores SIGTERM still goes.
      setTimeout(() => process.exit(1), 10_000).unref();
    }
  }, 500);
  timer.unref();
}
