// The OpenAPI 3.1 document of the whole API, generated from operations.ts: request bodies and
// queries from the routes' own zod schemas (zod 4's JSON Schema of their input, as a client sends
// it), response bodies from responses.ts (the JSON Schema of their output, as the server sends it),
// roles from the policy table, and the one error shape every refusal uses.
import { z } from "zod";
import { describeRoles, rolesFor, writes } from "@/lib/auth/policy";
import { operations, type Operation } from "./operations";
import { apiError } from "./responses";

type JsonSchema = Record<string, unknown>;

/** A request schema as a client fills it in ("input"), or a response as the server sends it ("output"). */
function schemaOf(schema: z.ZodType, io: "input" | "output" = "input"): JsonSchema {
  const { $schema: _ignored, ...rest } = z.toJSONSchema(schema, { io, unrepresentable: "any" }) as JsonSchema;
  return rest;
}

const errorRef = { $ref: "#/components/schemas/Error" };
const refusal = (description: string) => ({ description, content: { "application/json": { schema: errorRef } } });

function queryParameters(schema: z.ZodType) {
  const json = schemaOf(schema) as { properties?: Record<string, JsonSchema>; required?: string[] };
  return Object.entries(json.properties ?? {}).map(([name, s]) => ({
    name,
    in: "query",
    required: json.required?.includes(name) ?? false,
    schema: s,
  }));
}

function who(op: Operation): string {
  if (op.access === "public") return "Anyone (no sign-in).";
  const roles = describeRoles(rolesFor(op.access));
  const how = op.sessionOnly ? "a signed-in session only (not an API token)" : "a session or a bearer token";
  const tokenNote = op.method === "get" ? "" : " A read-only token is refused (403).";
  return `Roles: ${roles}, through ${how}.${tokenNote}`;
}

function operationObject(op: Operation) {
  const pathParams = [...op.path.matchAll(/\{(\w+)\}/g)].map((m) => ({
    name: m[1],
    in: "path",
    required: true,
    schema: { type: "string" },
  }));
  const responses: Record<string, unknown> = {
    [String(op.ok.status)]: {
      description: op.ok.description,
      content: op.ok.contentType
        ? { [op.ok.contentType]: { schema: { type: "string" } } }
        : { "application/json": { schema: op.ok.schema ? schemaOf(op.ok.schema, "output") : { type: "object" } } },
    },
  };
  const changes = op.method !== "get";
  if (op.access !== "public") {
    responses["401"] = refusal("Not signed in, or the bearer token is unknown, revoked or expired");
    responses["403"] = refusal("The role (or a read-only token) does not allow it");
    responses["429"] = refusal("Too many requests from this token; see Retry-After");
  }
  if (op.path.includes("{")) responses["404"] = refusal("Not found in your team");
  if (op.body || op.query || op.multipart) responses["422"] = refusal("Invalid input, named field by field");
  if (op.method === "patch")
    responses["409"] = refusal("Someone else changed it first, or it conflicts with what is stored");
  else if (changes && op.access !== "public" && op.access !== "engine.use")
    responses["409"] = refusal("It conflicts with what is stored (a name in use, a step already taken)");
  if (op.multipart || op.body) responses["413"] = refusal("The body is too large");
  if (op.body) responses["415"] = refusal("The body is not application/json");
  for (const [status, description] of Object.entries(op.refusals ?? {})) {
    if (description) responses[status] = refusal(description);
  }
  responses["500"] = refusal("An unexpected error; it is logged and nothing was changed");
  return {
    summary: op.summary,
    description: who(op),
    operationId: `${op.method}${op.path.replace(/[^A-Za-z0-9]+(\w)?/g, (_m, c: string | undefined) => (c ?? "").toUpperCase())}`,
    tags: [op.path.split("/")[2] ?? "api"],
    ...(op.access === "public" ? { security: [] } : {}),
    "x-roles": op.access === "public" ? [] : [...rolesFor(op.access)],
    "x-writes": op.access === "public" ? op.method !== "get" : writes(op.access) || op.method !== "get",
    parameters: [...pathParams, ...(op.query ? queryParameters(op.query) : [])],
    ...(op.body
      ? { requestBody: { required: true, content: { "application/json": { schema: schemaOf(op.body) } } } }
      : op.multipart
        ? {
            requestBody: {
              required: true,
              content: {
                "multipart/form-data": {
                  schema: {
                    type: "object",
                    properties: Object.fromEntries(
                      Object.entries(op.multipart).map(([k, d]) => [
                        k,
                        { type: "string", description: d, ...(k === "file" ? { contentMediaType: "text/csv" } : {}) },
                      ]),
                    ),
                    required: ["file"],
                  },
                },
              },
            },
          }
        : {}),
    responses,
  };
}

export function openApiDocument() {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const op of operations) (paths[op.path] ??= {})[op.method] = operationObject(op);
  return {
    openapi: "3.1.0",
    info: {
      title: "Sensewright API",
      version: "2",
      description:
        'Current-sense front-end design: solve, save, review, build. JSON numbers are SI base units with the unit in the field name; quantities in requests may be strings with a unit and an SI prefix ("150 mA"). Authenticate with a personal API token (Authorization: Bearer) or a signed-in session cookie.',
    },
    servers: [{ url: "/" }],
    security: [{ bearer: [] }, { session: [] }],
    components: {
      securitySchemes: {
        bearer: { type: "http", scheme: "bearer", description: "A personal API token from /account (swt_…)" },
        session: { type: "apiKey", in: "cookie", name: "next-auth.session-token" },
      },
      schemas: { Error: schemaOf(apiError, "output") },
    },
    paths,
  };
}
