import { getEnv } from "@/lib/env";
import { buildOpenApiDocument } from "@/lib/openapi";

export const dynamic = "force-dynamic";

export function GET() {
  return Response.json(buildOpenApiDocument(getEnv().APP_URL));
}
