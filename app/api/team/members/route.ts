import { json } from "@/lib/http";
import { signedInRoute } from "@/lib/http/signed-in-route";
import { listMembers } from "@/lib/services/members";

export const GET = signedInRoute(async ({ actor, db }) => json({ members: await listMembers(db, actor) }));
