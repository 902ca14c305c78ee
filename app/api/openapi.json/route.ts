import { apiRoute } from "@/lib/auth/gate";
import { openApiDocument } from "@/lib/api-description/openapi";

/** The OpenAPI 3.1 description of every route, generated from the routes' own schemas. */
export const GET = apiRoute({ action: "team.read", doing: "read the API description" }, async () =>
  Response.json(openApiDocument(), { headers: { "cache-control": "no-store" } }),
);
