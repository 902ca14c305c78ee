// Every API operation, described from the zod schemas its route validates with and the policy
// action its route names (so the roles shown are the roles enforced). openapi.ts turns this list
// into the OpenAPI 3.1 document; api-description.test.ts fails when a route file is missing here.
import { z } from "zod";
import { insertionSchema, requirementSchema } from "@/lib/design";
import {
  createTokenSchema,
  passwordChangeSchema,
  switchTeamSchema,
  updateAccountSchema,
} from "@/lib/auth/account-schemas";
import type { Action } from "@/lib/auth/policy";
import { designImportSchema } from "@/lib/build-sheet/exports";
import { editUnitSchema, recordUnitSchema } from "@/lib/built-units/schemas";
import { amplifierInput, amplifierPatch, shuntInput, shuntPatch } from "@/lib/library/schema";
import {
  auditQuery,
  invitationBodySchema,
  libraryExportQuery,
  netlistCandidateSchema,
  netlistQuery,
  designNetlistQuery,
  profileWindowQuery,
  reviewBodySchema,
  revisionsQuery,
  submitBodySchema,
} from "@/lib/route-schemas";
import { compareQuery } from "@/lib/saved-designs/compare";
import { createDesignSchema, patchDesignSchema } from "@/lib/saved-designs/service";
import { roleChangeSchema } from "@/lib/team-schemas";

export type Method = "get" | "post" | "patch" | "put" | "delete";

export type Operation = {
  method: Method;
  /** OpenAPI path: `{id}` where the route folder is `[id]`. */
  path: string;
  summary: string;
  /** The policy action the route checks; "public" for routes outside the gate; "signed-in" for any member. */
  access: Action | "public";
  /** Only a signed-in session may call it, not an API token. */
  sessionOnly?: boolean;
  body?: z.ZodType;
  query?: z.ZodType;
  /** multipart/form-data fields, by name. */
  multipart?: Record<string, string>;
  /** The success response: status, what it is, and its schema or content type. */
  ok: { status: number; description: string; schema?: z.ZodType; contentType?: string };
};

// Response shapes the tests check real answers against (api-description.spec.ts).
const iso = z.string().describe("ISO 8601 date and time");
export const responses = {
  health: z.object({ ok: z.literal(true), database: z.enum(["pglite", "postgres"]) }),
  me: z.object({
    user: z.object({ id: z.uuid(), email: z.string(), name: z.string() }),
    teams: z.array(
      z.object({ id: z.uuid(), name: z.string(), role: z.enum(["owner", "designer", "reviewer", "maker"]) }),
    ),
    currentTeamId: z.uuid(),
    mail: z.object({ submitted: z.boolean(), returned: z.boolean(), approved: z.boolean(), comments: z.boolean() }),
  }),
  switchedTeam: z.object({ currentTeamId: z.uuid(), teamName: z.string(), role: z.string() }),
  tokenCreated: z.object({
    id: z.uuid(),
    token: z.string().describe("the secret, shown this once"),
    name: z.string(),
    access: z.enum(["read", "write"]),
    teamId: z.uuid(),
    createdAt: iso,
    expiresAt: iso.nullable(),
  }),
  tokens: z.object({
    tokens: z.array(
      z.object({
        id: z.uuid(),
        name: z.string(),
        access: z.enum(["read", "write"]),
        hint: z.string(),
        teamId: z.uuid(),
        teamName: z.string(),
        createdAt: iso,
        expiresAt: iso.nullable(),
        lastUsedAt: iso.nullable(),
        expired: z.boolean(),
      }),
    ),
  }),
  designList: z
    .object({
      designs: z.array(
        z
          .object({
            id: z.uuid(),
            name: z.string(),
            status: z.enum(["draft", "in-review", "approved", "returned"]),
            revision: z.number().int(),
          })
          .loose(),
      ),
    })
    .loose(),
  designCreated: z.object({ id: z.uuid(), revision: z.literal(1), status: z.literal("draft") }).loose(),
  team: z.object({
    team: z.object({ id: z.uuid(), name: z.string() }).loose(),
    members: z.array(z.object({ userId: z.uuid(), email: z.string(), name: z.string(), role: z.string() }).loose()),
  }),
};

/** The invitation-accept body as its route reads it (public route; its schema lives with the route). */
const acceptBody = z.object({ token: z.string(), name: z.string().optional(), password: z.string() });

const json = (status: number, description: string, schema?: z.ZodType) => ({ status, description, schema });
const file = (contentType: string, description: string) => ({ status: 200, description, contentType });

export const operations: Operation[] = [
  {
    method: "get",
    path: "/api/openapi.json",
    summary: "This document",
    access: "team.read",
    ok: json(200, "OpenAPI 3.1"),
  },
  {
    method: "get",
    path: "/api/health",
    summary: "Is the server up",
    access: "public",
    ok: json(200, "up", responses.health),
  },
  {
    method: "get",
    path: "/api/me",
    summary: "You: your account, your teams and the current one",
    access: "account.manage",
    ok: json(200, "the account", responses.me),
  },
  {
    method: "patch",
    path: "/api/me",
    summary: "Change your display name or which review mail you get",
    access: "account.manage",
    body: updateAccountSchema,
    ok: json(200, "the account", responses.me),
  },
  {
    method: "put",
    path: "/api/me/team",
    summary: "Switch the session to another of your teams",
    access: "account.manage",
    sessionOnly: true,
    body: switchTeamSchema,
    ok: json(200, "switched", responses.switchedTeam),
  },
  {
    method: "put",
    path: "/api/me/password",
    summary: "Change your password; every other session of yours ends, this one is renewed",
    access: "account.manage",
    sessionOnly: true,
    body: passwordChangeSchema,
    ok: json(200, "{ok: true}"),
  },
  {
    method: "get",
    path: "/api/tokens",
    summary: "Your API tokens (never their secrets)",
    access: "account.manage",
    ok: json(200, "the tokens", responses.tokens),
  },
  {
    method: "post",
    path: "/api/tokens",
    summary: "Create an API token in the current team; the secret is in this answer only",
    access: "account.manage",
    sessionOnly: true,
    body: createTokenSchema,
    ok: json(201, "created", responses.tokenCreated),
  },
  {
    method: "delete",
    path: "/api/tokens/{id}",
    summary: "Revoke one of your tokens",
    access: "account.manage",
    ok: json(200, "{revoked: true, id}"),
  },
  {
    method: "get",
    path: "/api/team",
    summary: "The team and its members",
    access: "team.read",
    ok: json(200, "the team", responses.team),
  },
  {
    method: "patch",
    path: "/api/team/members/{userId}",
    summary: "Change a member's role",
    access: "team.manage-members",
    body: roleChangeSchema,
    ok: json(200, "{userId, role}"),
  },
  {
    method: "delete",
    path: "/api/team/members/{userId}",
    summary: "Remove a member",
    access: "team.manage-members",
    ok: json(200, "{userId, removed: true}"),
  },
  {
    method: "get",
    path: "/api/team/audit",
    summary: "The team's log, newest first",
    access: "team.read-log",
    query: auditQuery,
    ok: json(200, "{events: [...]}"),
  },
  {
    method: "get",
    path: "/api/outbox",
    summary: "Mail the built-in catcher holds",
    access: "team.read-outbox",
    ok: json(200, "{messages: [{to, subject, text, sentAt}]}"),
  },
  {
    method: "get",
    path: "/api/invitations",
    summary: "Invitations of the team",
    access: "team.manage-invitations",
    ok: json(200, "{invitations: [...]}"),
  },
  {
    method: "post",
    path: "/api/invitations",
    summary: "Invite someone (or someone to found a new team)",
    access: "team.manage-invitations",
    body: invitationBodySchema,
    ok: json(201, "the invitation with its single-use link"),
  },
  {
    method: "delete",
    path: "/api/invitations/{id}",
    summary: "Revoke a pending invitation",
    access: "team.manage-invitations",
    ok: json(200, "revoked"),
  },
  {
    method: "post",
    path: "/api/invitations/accept",
    summary: "Accept an invitation (signed out)",
    access: "public",
    body: acceptBody,
    ok: json(201, "{email, teamName, role}"),
  },
  {
    method: "post",
    path: "/api/solve",
    summary: "Sweep shunts and gains for a requirement",
    access: "engine.use",
    body: requirementSchema,
    ok: json(200, "candidates, counts and a range plan"),
  },
  {
    method: "post",
    path: "/api/insertion",
    summary: "What a series resistance does to the load",
    access: "engine.use",
    body: insertionSchema,
    ok: json(200, "{currentA, loadVoltageV, burdenV, currentChangePercent, powerInSeriesW}"),
  },
  {
    method: "post",
    path: "/api/netlist",
    summary: "SPICE netlist of a requirement and a chosen pair",
    access: "engine.use",
    body: z.object({ requirement: requirementSchema, candidate: netlistCandidateSchema }),
    query: netlistQuery,
    ok: file("text/plain", "the netlist"),
  },
  {
    method: "get",
    path: "/api/designs",
    summary: "The team's designs (makers: approved ones)",
    access: "design.read",
    ok: json(200, "the designs", responses.designList),
  },
  {
    method: "post",
    path: "/api/designs",
    summary: "Save a design: one shunt and gain (choice) or a range plan (plan), exactly one",
    access: "design.create",
    body: createDesignSchema,
    ok: json(201, "created", responses.designCreated),
  },
  {
    method: "post",
    path: "/api/designs/import",
    summary: "Import a design file as a new draft",
    access: "design.create",
    body: designImportSchema,
    ok: json(201, "created"),
  },
  {
    method: "get",
    path: "/api/designs/{id}",
    summary: "A design with its figures and revisions (a range plan: plan, metrics.ranges, ranges[k].benchCheck)",
    access: "design.read",
    ok: json(200, "the design"),
  },
  {
    method: "patch",
    path: "/api/designs/{id}",
    summary: "Edit a design (name, project, requirement, choice or plan): a new revision, or 409 when stale",
    access: "design.edit",
    body: patchDesignSchema,
    ok: json(200, "{revision}"),
  },
  {
    method: "get",
    path: "/api/designs/{id}/revisions",
    summary: "Every revision, with a diff of ?a= to ?b=",
    access: "design.read",
    query: revisionsQuery,
    ok: json(200, "the revisions"),
  },
  {
    method: "post",
    path: "/api/designs/{id}/submit",
    summary: "Submit for review (mails the reviewers)",
    access: "design.submit",
    body: submitBodySchema,
    ok: json(200, "{id, revision, status, mailed}"),
  },
  {
    method: "get",
    path: "/api/designs/{id}/reviews",
    summary: "Verdicts and comments",
    access: "design.read",
    ok: json(200, "the reviews"),
  },
  {
    method: "post",
    path: "/api/designs/{id}/reviews",
    summary: "Comment (any member), or approve or return (owners, reviewers; never the revision's author)",
    access: "design.comment",
    body: reviewBodySchema,
    ok: json(201, "{id, revision, status, mailed}"),
  },
  {
    method: "get",
    path: "/api/compare",
    summary: "Two to four designs side by side",
    access: "design.read",
    query: compareQuery,
    ok: json(200, "{designs: [...]}"),
  },
  {
    method: "get",
    path: "/api/designs/{id}/build-sheet",
    summary: "The build sheet",
    access: "design.read",
    ok: file("application/pdf", "the PDF"),
  },
  {
    method: "get",
    path: "/api/designs/{id}/netlist",
    summary: "The design's SPICE netlist (a range plan: one .op deck per range, or one with ?range=N)",
    access: "design.read",
    query: designNetlistQuery,
    ok: file("text/plain", "the netlist"),
  },
  {
    method: "get",
    path: "/api/designs/{id}/parts.csv",
    summary: "Parts list",
    access: "design.read",
    ok: file("text/csv", "the parts"),
  },
  {
    method: "get",
    path: "/api/designs/{id}/export",
    summary: "The design file (JSON) that imports back",
    access: "design.read",
    ok: json(200, "the design file"),
  },
  {
    method: "get",
    path: "/api/designs/{id}/profiles",
    summary: "Current recordings of the design",
    access: "design.read",
    ok: json(200, "{profiles: [...]}"),
  },
  {
    method: "post",
    path: "/api/designs/{id}/profiles",
    summary: "Upload a current recording (CSV, at most 10 MB)",
    access: "profile.upload",
    multipart: { file: "the CSV: a time column and a current column" },
    ok: json(201, "{id, samples, summary}"),
  },
  {
    method: "get",
    path: "/api/designs/{id}/profiles/{profileId}",
    summary: "One recording, decimated to ?width= columns over ?from=..?to=",
    access: "design.read",
    query: profileWindowQuery,
    ok: json(200, "summary and series"),
  },
  {
    method: "delete",
    path: "/api/designs/{id}/profiles/{profileId}",
    summary: "Delete a recording (its uploader or an owner)",
    access: "profile.delete",
    ok: json(200, "{deleted: true, id}"),
  },
  {
    method: "get",
    path: "/api/designs/{id}/units",
    summary: "Built units of an approved design, judged against its bench check, with measured and predicted yield",
    access: "design.read",
    ok: json(200, "{units, yield: {measured, predicted}, benchCheck, prediction}"),
  },
  {
    method: "post",
    path: "/api/designs/{id}/units",
    summary: "Record a built unit's bench readings (an approved design)",
    access: "unit.record",
    body: recordUnitSchema,
    ok: json(201, "{id, serial, pass, readings, cause, calibration}"),
  },
  {
    method: "post",
    path: "/api/designs/{id}/units/import",
    summary: "Record units from a CSV (one row per unit), all or nothing",
    access: "unit.record",
    multipart: { file: "CSV: serial, then one column per test point (name or current)" },
    ok: json(201, "{units}"),
  },
  {
    method: "get",
    path: "/api/designs/{id}/units/template.csv",
    summary: "An empty readings CSV with this design's test points as its header",
    access: "design.read",
    ok: file("text/csv", "the template"),
  },
  {
    method: "get",
    path: "/api/designs/{id}/units/calibration.csv",
    summary: "Each unit's gain and offset correction (corrected = gain · raw + offsetV)",
    access: "design.read",
    ok: file("text/csv", "one row per serial"),
  },
  {
    method: "get",
    path: "/api/designs/{id}/units/calibration.json",
    summary: "The same corrections as JSON",
    access: "design.read",
    ok: json(200, "{design, revision, units: [{serial, gain, offsetV, residualPercent}]}"),
  },
  {
    method: "get",
    path: "/api/designs/{id}/units/{unitId}",
    summary: "One built unit, judged",
    access: "design.read",
    ok: json(200, "the unit"),
  },
  {
    method: "patch",
    path: "/api/designs/{id}/units/{unitId}",
    summary: "Change a unit's serial, date or readings (makers: only units they recorded)",
    access: "unit.change",
    body: editUnitSchema,
    ok: json(200, "the unit, judged again"),
  },
  {
    method: "delete",
    path: "/api/designs/{id}/units/{unitId}",
    summary: "Delete a unit and its readings (makers: only units they recorded)",
    access: "unit.change",
    ok: json(200, "{deleted: true, id}"),
  },
  {
    method: "get",
    path: "/api/library",
    summary: "The parts library",
    access: "library.read",
    ok: json(200, "{amplifiers, shunts}"),
  },
  {
    method: "get",
    path: "/api/library/export",
    summary: "Library as CSV",
    access: "library.read",
    query: libraryExportQuery,
    ok: file("text/csv", "the CSV"),
  },
  {
    method: "post",
    path: "/api/library/import",
    summary: "Import parts from CSV, all or nothing",
    access: "library.edit",
    multipart: { file: "the CSV", kind: "amplifiers or shunts" },
    ok: json(200, "what was added and updated"),
  },
  {
    method: "post",
    path: "/api/library/amplifiers",
    summary: "Add an amplifier",
    access: "library.edit",
    body: amplifierInput,
    ok: json(201, "the part"),
  },
  {
    method: "patch",
    path: "/api/library/amplifiers/{id}",
    summary: "Edit an amplifier (409 when stale)",
    access: "library.edit",
    body: amplifierPatch,
    ok: json(200, "the part"),
  },
  {
    method: "delete",
    path: "/api/library/amplifiers/{id}",
    summary: "Remove an amplifier",
    access: "library.edit",
    ok: json(200, "removed"),
  },
  {
    method: "post",
    path: "/api/library/shunts",
    summary: "Add a shunt",
    access: "library.edit",
    body: shuntInput,
    ok: json(201, "the part"),
  },
  {
    method: "patch",
    path: "/api/library/shunts/{id}",
    summary: "Edit a shunt (409 when stale)",
    access: "library.edit",
    body: shuntPatch,
    ok: json(200, "the part"),
  },
  {
    method: "delete",
    path: "/api/library/shunts/{id}",
    summary: "Remove a shunt",
    access: "library.edit",
    ok: json(200, "removed"),
  },
];
