import { z } from "zod";

/** Queue names (kebab-case) and their payload schemas: checked on send and on receipt. */
export const QUEUES = {
  /** Round trip through the queue; used by health checks and tests of the worker's wiring. */
  systemPing: "system-ping",
} as const;

export const systemPingPayload = z.object({ sentAt: z.iso.datetime() });
export type SystemPingPayload = z.infer<typeof systemPingPayload>;
