import { z } from "zod";

/** A record id in a path or a body. */
export const uuidSchema = z.uuid({ error: "Not a valid id" });
