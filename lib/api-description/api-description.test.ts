// The API description covers every route file under app/api, method by method, and shows for each
// the same policy action its route enforces. (api-description.spec.ts checks real answers.)
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { openApiDocument } from "./openapi";
import { operations } from "./operations";

const apiRoot = path.join(process.cwd(), "app", "api");

function routeFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const full = path.join(dir, e.name);
    if (e.isDirectory()) return routeFiles(full);
    return e.name === "route.ts" ? [full] : [];
  });
}

/** app/api/designs/[id]/route.ts → /api/designs/{id}; next-auth's own catch-all is not ours to describe. */
const openApiPath = (file: string) =>
  "/api/" +
  path
    .relative(apiRoot, path.dirname(file))
    .split(path.sep)
    .map((seg) => seg.replace(/^\[(\w+)\]$/, "{$1}"))
    .join("/");

const routes = routeFiles(apiRoot)
  .filter((f) => !f.includes("[...nextauth]"))
  .flatMap((file) => {
    const text = fs.readFileSync(file, "utf8");
    return [...text.matchAll(/export const (GET|POST|PATCH|PUT|DELETE)\b/g)].map((m) => ({
      file,
      text,
      method: m[1]!.toLowerCase(),
      path: openApiPath(file),
    }));
  });

describe("the OpenAPI document", () => {
  const doc = openApiDocument();
  const documented = Object.entries(doc.paths).flatMap(([p, ops]) => Object.keys(ops).map((m) => `${m} ${p}`));

  it("finds the route files it walks", () => {
    expect(routes.length).toBeGreaterThan(40);
  });

  it("documents every method of every route file, and nothing that does not exist", () => {
    const present = routes.map((r) => `${r.method} ${r.path}`);
    expect(
      present.filter((r) => !documented.includes(r)),
      "routes missing from the document",
    ).toEqual([]);
    expect(
      documented.filter((d) => !present.includes(d)),
      "documented routes with no route file",
    ).toEqual([]);
  });

  it("shows for each route the policy action the route itself names", () => {
    const wrong = operations
      .filter((op) => op.access !== "public")
      .filter((op) => {
        const route = routes.find((r) => r.path === op.path && r.method === op.method);
        return !route || !route.text.includes(`action: "${op.access}"`);
      })
      .map((op) => `${op.method} ${op.path} (${op.access})`);
    expect(wrong).toEqual([]);
  });

  it("is OpenAPI 3.1 with the error shape on every refusal and roles in words", () => {
    expect(doc.openapi).toBe("3.1.0");
    const post = doc.paths["/api/designs"]?.post as {
      description: string;
      requestBody: { content: { "application/json": { schema: { required: string[] } } } };
      responses: Record<string, { content?: Record<string, { schema: unknown }> }>;
    };
    expect(post.description).toMatch(/Roles: owners and designers/);
    // `choice` or `plan`, one of them: the route says which is missing (API.md v2, "Designs").
    expect(post.requestBody.content["application/json"].schema.required).toEqual(["name", "requirement"]);
    expect(post.responses["403"]?.content?.["application/json"]?.schema).toEqual({
      $ref: "#/components/schemas/Error",
    });
    expect(JSON.parse(JSON.stringify(doc))).toEqual(doc); // plain JSON all the way down
  });
});

describe("response types on the client", () => {
  const componentsRoot = path.join(process.cwd(), "components");
  const sources = (dir: string): string[] =>
    fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
      const full = path.join(dir, e.name);
      if (e.isDirectory()) return sources(full);
      return /\.tsx?$/.test(e.name) && !/\.test\.tsx?$/.test(e.name) ? [full] : [];
    });

  it("come from responses.ts: no component declares the error shape or a body of its own again", () => {
    // The refusal's fields typed by hand are the sign of a re-declared response (issue 15, item 4).
    const handWritten = /\b(message\??: string;?\s*(fieldErrors|\})|fieldErrors\??: Record<string, string\[\]>)/;
    const offenders = sources(componentsRoot)
      .filter((f) => handWritten.test(fs.readFileSync(f, "utf8")))
      .map((f) => path.relative(process.cwd(), f));
    expect(offenders).toEqual([]);
  });
});
