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
import {
  adcInput,
  adcPatch,
  amplifierInput,
  amplifierPatch,
  meterInput,
  meterPatch,
  shuntInput,
  shuntPatch,
} from "@/lib/library/schema";
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
import { responses } from "./responses";

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
  /** The success response: status, what it is, and its schema (responses.ts) or a file's content type. */
  ok: { status: number; description: string; schema?: z.ZodType; contentType?: string };
  /** Refusals particular to this route, beyond those every route of its kind has (openapi.ts). */
  refusals?: Partial<Record<number, string>>;
};

/** The invitation-accept body as its route reads it (public route; its schema lives with the route). */
const acceptBody = z.object({ token: z.string(), name: z.string().optional(), password: z.string() });

const json = (status: number, description: string, schema: z.ZodType) => ({ status, description, schema });
const file = (contentType: string, description: string) => ({ status: 200, description, contentType });

export const operations: Operation[] = [
  {
    method: "get",
    path: "/api/openapi.json",
    summary: "This document",
    access: "team.read",
    ok: json(200, "this OpenAPI 3.1 document", responses.openApi),
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
    refusals: { 404: "You are not a member of that team" },
  },
  {
    method: "put",
    path: "/api/me/password",
    summary: "Change your password; every other session of yours ends, this one is renewed",
    access: "account.manage",
    sessionOnly: true,
    body: passwordChangeSchema,
    ok: json(200, "changed; this session renewed", responses.passwordChanged),
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
    ok: json(200, "revoked", responses.tokenRevoked),
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
    summary: "Change a member's role (the member is told by e-mail)",
    access: "team.manage-members",
    body: roleChangeSchema,
    ok: json(200, "the new role", responses.roleChanged),
  },
  {
    method: "delete",
    path: "/api/team/members/{userId}",
    summary: "Remove a member",
    access: "team.manage-members",
    ok: json(200, "removed", responses.memberRemoved),
  },
  {
    method: "get",
    path: "/api/team/audit",
    summary: "The team's log, newest first",
    access: "team.read-log",
    query: auditQuery,
    ok: json(200, "the events", responses.audit),
  },
  {
    method: "get",
    path: "/api/outbox",
    summary: "Mail the built-in catcher holds",
    access: "team.read-outbox",
    ok: json(200, "the messages", responses.outbox),
    refusals: { 409: "Mail goes out through an SMTP server, so there is no outbox to read" },
  },
  {
    method: "get",
    path: "/api/invitations",
    summary: "Invitations of the team",
    access: "team.manage-invitations",
    ok: json(200, "the invitations", responses.invitations),
  },
  {
    method: "post",
    path: "/api/invitations",
    summary: "Invite someone (or someone to found a new team)",
    access: "team.manage-invitations",
    body: invitationBodySchema,
    ok: json(201, "the invitation with its single-use link", responses.invitationCreated),
  },
  {
    method: "delete",
    path: "/api/invitations/{id}",
    summary: "Revoke a pending invitation",
    access: "team.manage-invitations",
    ok: json(200, "revoked", responses.invitationRevoked),
  },
  {
    method: "post",
    path: "/api/invitations/accept",
    summary: "Accept an invitation (signed out)",
    access: "public",
    body: acceptBody,
    ok: json(201, "joined", responses.invitationAccepted),
    refusals: {
      401: "An existing account must be signed in as itself to join",
      403: "Signed in as someone else than the invitation names",
      404: "No such invitation",
      409: "The invitation was used, revoked or has expired",
    },
  },
  {
    method: "post",
    path: "/api/solve",
    summary: "Sweep shunts and gains for a requirement",
    access: "engine.use",
    body: requirementSchema,
    ok: json(200, "candidates, counts, a range plan, and a diagnosis when nothing is feasible", responses.solve),
  },
  {
    method: "post",
    path: "/api/insertion",
    summary: "What a series resistance does to the load",
    access: "engine.use",
    body: insertionSchema,
    ok: json(200, "the operating point", responses.insertion),
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
    ok: json(201, "created", responses.designImported),
  },
  {
    method: "get",
    path: "/api/designs/{id}",
    summary: "A design with its figures and revisions (a range plan: plan, metrics.ranges, ranges[k].benchCheck)",
    access: "design.read",
    ok: json(
      200,
      "the design: its pair (choice) or its range plan (plan), figures, revisions, reviews",
      responses.design,
    ),
  },
  {
    method: "patch",
    path: "/api/designs/{id}",
    summary: "Edit a design (name, project, requirement, choice or plan): a new revision, or 409 when stale",
    access: "design.edit",
    body: patchDesignSchema,
    ok: json(200, "the new revision (or, when nothing changed, the same one)", responses.designRevised),
  },
  {
    method: "get",
    path: "/api/designs/{id}/revisions",
    summary: "Every revision, with a diff of ?a= to ?b=",
    access: "design.read",
    query: revisionsQuery,
    ok: json(200, "the revisions, or two of them and what changed", responses.revisions),
  },
  {
    method: "post",
    path: "/api/designs/{id}/submit",
    summary: "Submit for review (mails the reviewers)",
    access: "design.submit",
    body: submitBodySchema,
    ok: json(200, "in review", responses.statusChange),
  },
  {
    method: "get",
    path: "/api/designs/{id}/reviews",
    summary: "Verdicts and comments",
    access: "design.read",
    ok: json(200, "the reviews", responses.reviews),
  },
  {
    method: "post",
    path: "/api/designs/{id}/reviews",
    summary: "Comment (any member), or approve or return (owners, reviewers; never the revision's author)",
    access: "design.comment",
    body: reviewBodySchema,
    ok: json(201, "recorded", responses.statusChange),
  },
  {
    method: "get",
    path: "/api/compare",
    summary: "Two to four designs side by side",
    access: "design.read",
    query: compareQuery,
    ok: json(200, "the designs", responses.compare),
  },
  {
    method: "get",
    path: "/api/designs/{id}/build-sheet",
    summary: "The build sheet",
    access: "design.read",
    ok: file("application/pdf", "the PDF"),
    refusals: { 409: "A saved range plan that fails under the current model (the message names the constraint)" },
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
    refusals: { 409: "A saved range plan that fails under the current model (the message names the constraint)" },
  },
  {
    method: "get",
    path: "/api/designs/{id}/export",
    summary: "The design file (JSON) that imports back",
    access: "design.read",
    ok: json(200, "the design file", responses.designExport),
  },
  {
    method: "get",
    path: "/api/designs/{id}/profiles",
    summary: "Current recordings of the design",
    access: "design.read",
    ok: json(200, "the recordings", responses.profiles),
  },
  {
    method: "post",
    path: "/api/designs/{id}/profiles",
    summary: "Upload a current recording (CSV, at most 10 MB)",
    access: "profile.upload",
    multipart: { file: "the CSV: a time column and a current column" },
    ok: json(201, "stored", responses.profileUploaded),
  },
  {
    method: "get",
    path: "/api/designs/{id}/profiles/{profileId}",
    summary: "One recording, decimated to ?width= columns over ?from=..?to=",
    access: "design.read",
    query: profileWindowQuery,
    ok: json(200, "summary and series", responses.profile),
  },
  {
    method: "delete",
    path: "/api/designs/{id}/profiles/{profileId}",
    summary: "Delete a recording (its uploader or an owner)",
    access: "profile.delete",
    ok: json(200, "deleted", responses.deleted),
  },
  {
    method: "get",
    path: "/api/designs/{id}/units",
    summary: "Built units of an approved design, judged against its bench check, with measured and predicted yield",
    access: "design.read",
    ok: json(200, "the units, yield, spread check, prediction and calibrated accuracy", responses.units),
  },
  {
    method: "post",
    path: "/api/designs/{id}/units",
    summary: "Record a built unit's bench readings (an approved design)",
    access: "unit.record",
    body: recordUnitSchema,
    ok: json(201, "the unit, judged", responses.unit),
  },
  {
    method: "post",
    path: "/api/designs/{id}/units/import",
    summary: "Record units from a CSV (one row per unit), all or nothing",
    access: "unit.record",
    multipart: { file: "CSV: serial, then one column per test point (name or current)" },
    ok: json(201, "recorded", responses.unitsImported),
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
    ok: json(200, "the corrections", responses.calibration),
  },
  {
    method: "get",
    path: "/api/designs/{id}/units/{unitId}",
    summary: "One built unit, judged",
    access: "design.read",
    ok: json(200, "the unit", responses.unit),
  },
  {
    method: "patch",
    path: "/api/designs/{id}/units/{unitId}",
    summary: "Change a unit's serial, date or readings (makers: only units they recorded)",
    access: "unit.change",
    body: editUnitSchema,
    ok: json(200, "the unit, judged again", responses.unit),
  },
  {
    method: "delete",
    path: "/api/designs/{id}/units/{unitId}",
    summary: "Delete a unit and its readings (makers: only units they recorded)",
    access: "unit.change",
    ok: json(200, "deleted", responses.deleted),
  },
  {
    method: "get",
    path: "/api/library",
    summary: "The parts library",
    access: "library.read",
    ok: json(200, "the parts", responses.library),
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
    multipart: { file: "the CSV", kind: "amplifiers, shunts, adcs or meters" },
    ok: json(200, "what was added and updated", responses.libraryImported),
  },
  {
    method: "post",
    path: "/api/library/amplifiers",
    summary: "Add an amplifier",
    access: "library.edit",
    body: amplifierInput,
    ok: json(201, "the part", responses.amplifier),
  },
  {
    method: "patch",
    path: "/api/library/amplifiers/{id}",
    summary: "Edit an amplifier (409 when stale)",
    access: "library.edit",
    body: amplifierPatch,
    ok: json(200, "the part", responses.amplifier),
  },
  {
    method: "delete",
    path: "/api/library/amplifiers/{id}",
    summary: "Remove an amplifier",
    access: "library.edit",
    ok: json(200, "removed", responses.deleted),
  },
  {
    method: "post",
    path: "/api/library/shunts",
    summary: "Add a shunt",
    access: "library.edit",
    body: shuntInput,
    ok: json(201, "the part", responses.shunt),
  },
  {
    method: "patch",
    path: "/api/library/shunts/{id}",
    summary: "Edit a shunt (409 when stale)",
    access: "library.edit",
    body: shuntPatch,
    ok: json(200, "the part", responses.shunt),
  },
  {
    method: "delete",
    path: "/api/library/shunts/{id}",
    summary: "Remove a shunt",
    access: "library.edit",
    ok: json(200, "removed", responses.deleted),
  },
  {
    method: "post",
    path: "/api/library/adcs",
    summary: "Add an ADC",
    access: "library.edit",
    body: adcInput,
    ok: json(201, "the part", responses.adc),
  },
  {
    method: "patch",
    path: "/api/library/adcs/{id}",
    summary: "Edit an ADC (409 when stale)",
    access: "library.edit",
    body: adcPatch,
    ok: json(200, "the part", responses.adc),
  },
  {
    method: "delete",
    path: "/api/library/adcs/{id}",
    summary: "Remove an ADC",
    access: "library.edit",
    ok: json(200, "removed", responses.deleted),
  },
  {
    method: "post",
    path: "/api/library/meters",
    summary: "Add a meter range",
    access: "library.edit",
    body: meterInput,
    ok: json(201, "the part", responses.meter),
  },
  {
    method: "patch",
    path: "/api/library/meters/{id}",
    summary: "Edit a meter range (409 when stale)",
    access: "library.edit",
    body: meterPatch,
    ok: json(200, "the part", responses.meter),
  },
  {
    method: "delete",
    path: "/api/library/meters/{id}",
    summary: "Remove a meter range",
    access: "library.edit",
    ok: json(200, "removed", responses.deleted),
  },
];
