import { openApiDocument } from "@/lib/api/openapi";
import { route } from "@/lib/api/route";

// GET /api/v1/openapi.json - the OpenAPI 3.0 description of API v1, from the same zod schemas the routes parse with
export const GET = route({}, () => Response.json(openApiDocument()));
