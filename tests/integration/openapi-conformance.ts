// Checks real answers against the OpenAPI document the server serves: each answer's status must be
// one the document lists for that operation, and its body must validate against the JSON Schema
// the document gives for it (Ajv, JSON Schema 2020-12, with the standard formats). A recorder
// remembers which operations answered, so a spec can fail on any documented operation it never saw.
import { expect, type APIRequestContext, type APIResponse } from "@playwright/test";
import Ajv2020, { type ValidateFunction } from "ajv/dist/2020.js";
import addFormats from "ajv-formats";

type JsonSchema = Record<string, unknown>;
type ResponseObject = { description: string; content?: Record<string, { schema: JsonSchema }> };
type OperationObject = { responses: Record<string, ResponseObject> };
export type OpenApiDocument = {
  openapi: string;
  paths: Record<string, Record<string, OperationObject>>;
  components: { schemas: Record<string, JsonSchema> };
};

type Template = { path: string; pattern: RegExp };

const templateOf = (path: string): Template => ({
  path,
  pattern: new RegExp(`^${path.replace(/[.]/g, "\\.").replace(/\{\w+\}/g, "[^/]+")}$`),
});

export class Conformance {
  private readonly ajv = new Ajv2020({ allErrors: true, strict: false });
  private readonly templates: Template[];
  private readonly validators = new Map<string, ValidateFunction>();
  /** `get /api/designs/{id}` → the statuses seen. */
  readonly seen = new Map<string, Set<number>>();

  constructor(readonly doc: OpenApiDocument) {
    addFormats(this.ajv);
    // Literal segments first, so /api/designs/import is not taken for /api/designs/{id}.
    this.templates = Object.keys(doc.paths)
      .sort((a, b) => a.split("{").length - b.split("{").length)
      .map(templateOf);
  }

  /** Every `method path` the document lists. */
  operations(): string[] {
    return Object.entries(this.doc.paths).flatMap(([p, ops]) => Object.keys(ops).map((m) => `${m} ${p}`));
  }

  private operationOf(method: string, url: string): { key: string; op: OperationObject } {
    const pathname = new URL(url, "http://x").pathname;
    const template = this.templates.find((t) => t.pattern.test(pathname) && this.doc.paths[t.path]?.[method]);
    expect(template, `${method.toUpperCase()} ${pathname} is not in the document`).toBeTruthy();
    return { key: `${method} ${template!.path}`, op: this.doc.paths[template!.path]![method]! };
  }

  private validator(key: string, status: string, schema: JsonSchema): ValidateFunction {
    const id = `${key} ${status}`;
    let v = this.validators.get(id);
    if (!v) {
      // The response schemas point at #/components/...: validate with the components beside them.
      v = this.ajv.compile({ ...schema, components: this.doc.components });
      this.validators.set(id, v);
    }
    return v;
  }

  /** Fails unless the answer's status is documented and its body matches the documented schema. */
  async check(method: string, url: string, res: APIResponse): Promise<void> {
    const { key, op } = this.operationOf(method.toLowerCase(), url);
    const status = String(res.status());
    const documented = op.responses[status];
    expect(documented, `${key} answered ${status}, which the document does not list: ${await res.text()}`).toBeTruthy();
    (this.seen.get(key) ?? this.seen.set(key, new Set()).get(key)!).add(res.status());
    const [type, media] = Object.entries(documented!.content ?? {})[0] ?? [];
    const contentType = res.headers()["content-type"] ?? "";
    if (!type || !media) return;
    expect(contentType.split(";")[0], `${key} ${status} content type`).toBe(type);
    if (type !== "application/json") {
      expect((await res.body()).length, `${key} ${status} has a body`).toBeGreaterThan(0);
      return;
    }
    const validate = this.validator(key, status, media.schema);
    const body: unknown = await res.json();
    const ok = validate(body);
    expect(
      ok,
      `${key} ${status} does not match the document:\n${this.ajv.errorsText(validate.errors, { separator: "\n" })}`,
    ).toBe(true);
  }

  /** An API context whose every answer is checked against the document as it arrives. */
  checked(ctx: APIRequestContext) {
    const send =
      (method: "get" | "post" | "patch" | "put" | "delete") =>
      async (url: string, options?: Parameters<APIRequestContext["fetch"]>[1]): Promise<APIResponse> => {
        const res = await ctx.fetch(url, { ...options, method: method.toUpperCase() });
        await this.check(method, url, res);
        return res;
      };
    return { get: send("get"), post: send("post"), patch: send("patch"), put: send("put"), delete: send("delete") };
  }
}
