// Every JSON body the API answers with, as zod schemas: operations.ts documents each route with
// them (the OpenAPI document is generated from these), the HTTP suite validates real answers
// against the emitted JSON Schema, and client components import the inferred types below instead
// of declaring their own (`import type`, so no schema code reaches the browser).
import { z } from "zod";
import { designStatusEnum, roleEnum, tokenAccessEnum, verdictEnum } from "@/db/schema";
import { gainModes } from "@/lib/library/schema";
import {
  benchCheckRowShape,
  budgetSource,
  candidateDetailShape,
  choiceShape,
  insertionShape,
  planChoiceShape,
  profileDesignShape,
  profileSummaryShape,
  requirementShape,
  solveShape,
} from "./engine-shapes";

const iso = z.string().describe("ISO 8601 date and time (UTC)");
const day = z.string().describe("a calendar day, YYYY-MM-DD");
const id = z.string().describe("a UUID");
const role = z.enum(roleEnum.enumValues);
const designStatus = z.enum(designStatusEnum.enumValues);
const tokenAccess = z.enum(tokenAccessEnum.enumValues);

/** The one error shape of every refusal (401, 403, 404, 409, 413, 415, 422, 429, 500). */
export const apiError = z
  .object({
    message: z.string().describe("What went wrong, in words; never repeats a secret"),
    fieldErrors: z
      .record(z.string(), z.array(z.string()))
      .optional()
      .describe("Per dotted field path, what is wrong with it"),
    suggestedName: z.string().optional().describe("409 on an import: a name that is free in the team"),
    row: z.number().int().optional().describe("CSV uploads: the 1-based data row refused"),
    line: z.number().int().optional().describe("CSV uploads: the 1-based line of the file"),
    column: z.string().optional().describe("CSV uploads: the column refused, as written in the header"),
    problems: z
      .array(
        z.object({
          row: z.number().int().optional(),
          line: z.number().int().optional(),
          column: z.string().optional(),
          message: z.string(),
        }),
      )
      .optional()
      .describe("Library imports: every row refused, up to a limit"),
  })
  .describe("A refusal");
export type ApiError = z.infer<typeof apiError>;

// Account, tokens, team.
const mailChoices = z.object({
  submitted: z.boolean(),
  returned: z.boolean(),
  approved: z.boolean(),
  comments: z.boolean(),
});
const teamOfMine = z.object({ id, name: z.string(), role });
const me = z.object({
  user: z.object({ id, email: z.string(), name: z.string() }),
  teams: z.array(teamOfMine),
  currentTeamId: id,
  mail: mailChoices,
});
const tokenRow = z.object({
  id,
  name: z.string(),
  access: tokenAccess,
  hint: z.string().describe("the secret's first characters, to tell tokens apart"),
  teamId: id,
  teamName: z.string(),
  createdAt: iso,
  expiresAt: iso.nullable(),
  lastUsedAt: iso.nullable(),
  expired: z.boolean(),
});
const member = z.object({ userId: id, email: z.string(), name: z.string(), role, joinedAt: iso });
const invitationRow = z.object({
  id,
  email: z.string(),
  role,
  status: z.enum(["pending", "accepted", "revoked", "expired"]),
  invitedByName: z.string(),
  createdAt: iso,
  expiresAt: iso,
  acceptedAt: iso.nullable(),
  revokedAt: iso.nullable(),
});
const auditEvent = z.object({
  id,
  action: z.string(),
  targetType: z.string().nullable(),
  targetId: z.string().nullable(),
  details: z.record(z.string(), z.unknown()),
  at: iso,
  actorName: z.string().nullable(),
  actorEmail: z.string().nullable(),
});

// Designs.
const approval = z.object({ revision: z.number().int(), byName: z.string(), byId: id, at: iso });
const review = z.object({
  id,
  revision: z.number().int(),
  verdict: z.enum(verdictEnum.enumValues),
  body: z.string(),
  parentId: id.nullable(),
  authorId: id,
  authorName: z.string(),
  createdAt: iso,
});
/** A plan design's figures: one set per range (API.md v2, "Designs"). */
const planMetrics = z.object({ ranges: z.array(candidateDetailShape.loose()) });
/** A design has either one pair (`choice`) or a range plan (`plan`), and the figures of the one it has. */
const pairOrPlan = <T extends z.ZodRawShape>(shape: T) =>
  z.union([
    z.object({
      ...shape,
      kind: z.literal("pair").optional(),
      choice: choiceShape,
      plan: z.null().optional(),
      metrics: candidateDetailShape,
    }),
    z.object({
      ...shape,
      kind: z.literal("plan").optional(),
      choice: z.null().optional(),
      plan: planChoiceShape,
      metrics: planMetrics,
    }),
  ]);
const revisionRow = pairOrPlan({
  revision: z.number().int(),
  name: z.string(),
  requirement: requirementShape,
  authorId: id,
  authorName: z.string(),
  createdAt: iso,
  approval: approval.nullable(),
});
const designRow = z.object({
  id,
  name: z.string(),
  project: z.string().nullable(),
  status: designStatus,
  revision: z.number().int(),
  updatedAt: iso,
  authorName: z.string(),
  shuntOhms: z.number().nullable().describe("the pair's shunt (null for a range plan)"),
  gain: z.number().nullable(),
  planRanges: z.number().int().nullable().describe("how many ranges a range plan has (null for a pair)"),
  failsCurrentModel: z
    .boolean()
    .describe("true when the current revision's pair or plan fails under today's model (its page names what fails)"),
});
const designSummary = {
  id,
  name: z.string(),
  project: z.string().nullable(),
  status: designStatus,
  revision: z.number().int(),
  requirement: requirementShape,
};
const designFields = {
  ...designSummary,
  authorId: id,
  authorName: z.string(),
  createdAt: iso,
  updatedAt: iso,
  approval: approval.nullable(),
  revisions: z.array(
    z.object({
      revision: z.number().int(),
      name: z.string(),
      kind: z.enum(["pair", "plan"]).optional().describe("a single pair or a range plan"),
      authorId: id.optional(),
      authorName: z.string(),
      createdAt: iso,
      choice: choiceShape.nullable().optional(),
      plan: planChoiceShape.nullable().optional(),
      approval: approval.nullable(),
    }),
  ),
  reviews: z.array(review),
};
const benchCheck = z.array(benchCheckRowShape);
const design = z.union([
  z.object({
    ...designFields,
    kind: z.literal("pair").describe("one shunt and gain"),
    choice: choiceShape,
    metrics: candidateDetailShape,
    benchCheck,
  }),
  z.object({
    ...designFields,
    kind: z.literal("plan").describe("a range plan"),
    plan: planChoiceShape,
    metrics: planMetrics,
    ranges: z
      .array(z.object({ minA: z.number(), maxA: z.number(), shuntOhms: z.number(), gain: z.number(), benchCheck }))
      .describe("per range, its bench check (API.md v2: ranges[k].benchCheck)"),
  }),
]);
const change = z.object({
  group: z.enum(["design", "requirement", "choice", "plan", "figures"]),
  path: z.string(),
  label: z.string(),
  a: z.unknown(),
  b: z.unknown(),
  aText: z.string(),
  bText: z.string(),
});
const statusChange = z.object({ id, revision: z.number().int(), status: designStatus, mailed: z.number().int() });
const exportFile = z.object({
  format: z.literal("sensewright-design"),
  version: z.literal(1),
  name: z.string(),
  project: z.string().nullable(),
  requirement: requirementShape,
  choice: choiceShape.optional().describe("a single pair's shunt and gain (absent on a range plan)"),
  plan: planChoiceShape.optional().describe("a range plan (absent on a single pair)"),
  exportedAt: iso,
  source: z.object({ designId: id, revision: z.number().int(), status: designStatus }),
  metrics: z.union([candidateDetailShape, planMetrics]),
});

// Recordings.
/** A plan design's recording summary adds the switching figures (API.md v2: rangeSwitches, timeInRangeS). */
const recordingSummary = profileSummaryShape.extend({
  rangeSwitches: z.number().int().optional(),
  timeInRangeS: z.array(z.number()).optional(),
  samplesInRange: z.array(z.number().int()).optional(),
  switchDelayS: z.number().optional(),
  belowStepSamples: z.number().int().optional(),
  clippedBeforeSwitchSamples: z.number().int().optional(),
  clippedBeforeSwitchPercent: z.number().optional(),
});
const planProfileRange = z.object({
  minA: z.number(),
  maxA: z.number(),
  shuntOhms: z.number(),
  gain: z.number(),
  switchOhms: z.number(),
  lsbA: z.number(),
  resolvableStepA: z.number(),
  clipCurrentA: z.number(),
});
const recordingDesign = z.discriminatedUnion("kind", [
  profileDesignShape.extend({ kind: z.literal("pair") }),
  z.object({
    kind: z.literal("plan"),
    supplyV: z.number(),
    fullScaleV: z.number(),
    switchDelayS: z.number(),
    lsbA: z.number(),
    ranges: z.array(planProfileRange),
    switchPoints: z.array(z.object({ upA: z.number(), downA: z.number() })),
  }),
]);
const planSeries = z.object({
  ranges: z.array(z.object({ range: z.number().int(), fromS: z.number(), toS: z.number() })),
  rangeAt: z.array(z.number().int()),
  loadV: z.array(z.number()),
});
const profileItem = z.object({
  id,
  fileName: z.string(),
  samples: z.number().int(),
  revision: z.number().int(),
  summary: recordingSummary,
  uploadedBy: id,
  uploadedByName: z.string(),
  createdAt: iso,
});
const stretch = z.tuple([z.number(), z.number()]);

// Built units.
const calibration = z.object({
  gain: z.number(),
  offsetV: z.number(),
  residualPercent: z.number(),
  method: z.enum(["least-squares", "two-point", "gain-only", "none"]),
  points: z.number().int(),
});
const unitView = z.object({
  id,
  designId: id,
  revision: z.number().int(),
  serial: z.string(),
  builtOn: day,
  recordedBy: id,
  recordedByName: z.string(),
  createdAt: iso,
  updatedAt: iso,
  pass: z.boolean(),
  readings: z.array(
    benchCheckRowShape.extend({
      outputV: z.number(),
      inBand: z.boolean(),
      errorV: z.number(),
      errorPercent: z.number(),
      atFloor: z.boolean(),
      correctedV: z.number(),
      correctedErrorPercent: z.number(),
      outsideSpread: z.boolean().nullable(),
    }),
  ),
  cause: z.string().nullable(),
  causeKind: z.enum(["no-output", "dead-zone", "offset", "gain", "self-heating", "mixed", "single-point"]).nullable(),
  calibration,
  outsideSpread: z.boolean().nullable(),
});
const unitsSummary = z.object({
  units: z.array(unitView),
  yield: z.object({
    measured: z.number().nullable().describe("share of recorded units that pass, 0..1"),
    predicted: z.number().nullable().describe("share the Monte Carlo model expects to pass, 0..1"),
    revision: z.number().int().nullable(),
    units: z.number().int(),
    passing: z.number().int(),
  }),
  spread: z
    .object({
      units: z.number().int(),
      outside: z.number().int(),
      expectedShare: z.number(),
      pValue: z.number(),
      flagged: z.boolean(),
      text: z.string(),
      revision: z.number().int(),
    })
    .nullable(),
  prediction: z
    .object({
      draws: z.number().int(),
      seed: z.number().int(),
      ambientC: z.number(),
      points: z.array(
        benchCheckRowShape.extend({
          p1V: z.number(),
          p5V: z.number(),
          p50V: z.number(),
          p95V: z.number(),
          p99V: z.number(),
          histogram: z.array(z.object({ fromV: z.number(), toV: z.number(), share: z.number() })),
        }),
      ),
      yield: z.number(),
      outsideSpread: z.number(),
      revision: z.number().int(),
    })
    .nullable(),
  calibratedAccuracy: z
    .object({
      removed: z.array(z.object({ source: budgetSource, label: z.string() })),
      remaining: z.array(z.object({ source: budgetSource, label: z.string(), why: z.string() })),
      atMinPercent: z.number(),
      atMaxPercent: z.number(),
      bandWorstPercent: z.number(),
      uncalibratedBandWorstPercent: z.number(),
      lowestAccurateCurrentA: z.number().nullable(),
      curve: z.array(
        z.object({ currentA: z.number(), calibratedPercent: z.number(), uncalibratedPercent: z.number() }),
      ),
    })
    .nullable(),
  benchCheck: z.array(benchCheckRowShape),
});

// The parts library.
const stamps = { id, teamId: id, name: z.string(), createdAt: iso, updatedAt: iso };
const amplifierPart = z.object({
  ...stamps,
  gainMode: z.enum(gainModes),
  gains: z.array(z.number()),
  offsetV: z.number(),
  offsetDriftVPerK: z.number(),
  gainErrorFraction: z.number(),
  gainDriftPerK: z.number(),
  biasCurrentA: z.number(),
  noiseDensityVPerRtHz: z.number(),
  gbwHz: z.number(),
  swingLowV: z.number(),
  swingHighV: z.number(),
  cmrrDb: z.number(),
  supplyMinV: z.number(),
  supplyMaxV: z.number(),
  topology: z.string(),
  commonModeMinV: z.number().nullable(),
  commonModeMaxV: z.number().nullable(),
});
const shuntPart = z.object({
  ...stamps,
  series: z.string(),
  minOhms: z.number(),
  maxOhms: z.number(),
  toleranceFraction: z.number(),
  tempcoPerK: z.number(),
  ratingsW: z.array(z.number()),
  fourTerminal: z.boolean(),
});
// Readout parts under the requirement's readout names (API.md v2).
const adcPart = z.object({
  ...stamps,
  bits: z.number().int(),
  fullScale: z.number(),
  sampleRateHz: z.number(),
  reference: z.object({ tolerance: z.number(), tempco: z.number() }),
  offsetLsb: z.number(),
  gainError: z.number(),
  inlLsb: z.number(),
});
const meterPart = z.object({
  ...stamps,
  fullScale: z.number(),
  counts: z.number().int(),
  accuracy: z.object({ percentOfReading: z.number(), digits: z.number() }),
});
const deleted = z.object({ deleted: z.literal(true), id });

export const responses = {
  health: z.object({ ok: z.literal(true), database: z.enum(["pglite", "postgres"]) }),
  openApi: z
    .object({ openapi: z.literal("3.1.0"), info: z.object({ title: z.string(), version: z.string() }).loose() })
    .loose()
    .describe("this OpenAPI 3.1 document"),
  me,
  switchedTeam: z.object({ currentTeamId: id, teamName: z.string(), role }),
  passwordChanged: z.object({ ok: z.literal(true) }),
  tokenCreated: z.object({
    id,
    token: z.string().describe("the secret, shown this once"),
    name: z.string(),
    access: tokenAccess,
    teamId: id,
    createdAt: iso,
    expiresAt: iso.nullable(),
  }),
  tokens: z.object({ tokens: z.array(tokenRow) }),
  tokenRevoked: z.object({ revoked: z.literal(true), id }),
  team: z.object({ team: z.object({ id, name: z.string() }), members: z.array(member) }),
  roleChanged: z.object({
    userId: id,
    role,
    mailed: z.number().int().describe("messages queued to the member (0: the role did not change)"),
  }),
  memberRemoved: z.object({ userId: id, removed: z.literal(true) }),
  audit: z.object({ events: z.array(auditEvent) }),
  outbox: z.object({
    messages: z.array(
      z.object({ to: z.string(), from: z.string(), subject: z.string(), text: z.string(), sentAt: iso }),
    ),
  }),
  invitations: z.object({ invitations: z.array(invitationRow) }),
  invitationCreated: z.object({
    id,
    email: z.string(),
    role,
    teamName: z.string(),
    status: z.literal("pending"),
    expiresAt: iso,
    link: z.string().describe("the single-use link, shown to the sender this once"),
    mailed: z.number().int(),
  }),
  invitationRevoked: z.object({ id, status: z.literal("revoked"), revokedAt: iso }),
  invitationAccepted: z.object({ email: z.string(), teamName: z.string(), role, newAccount: z.boolean() }),
  solve: solveShape,
  insertion: insertionShape,
  designList: z.object({ designs: z.array(designRow), nextCursor: z.string().nullable() }),
  designCreated: z.object({ id, revision: z.literal(1), status: z.literal("draft") }),
  designImported: z.object({ id, revision: z.literal(1), status: z.literal("draft"), name: z.string() }),
  design,
  designRevised: z.object({
    revision: z.number().int(),
    unchanged: z.literal(true).optional().describe("nothing changed, so no revision was made"),
  }),
  revisions: z.union([
    z.object({ id, revision: z.number().int(), revisions: z.array(revisionRow) }),
    z.object({ id, a: revisionRow, b: revisionRow, changes: z.array(change) }).describe("with ?a=&b="),
  ]),
  statusChange,
  reviews: z.object({ id, revision: z.number().int(), status: designStatus, reviews: z.array(review) }),
  compare: z.object({
    designs: z.array(pairOrPlan({ ...designSummary, authorName: z.string(), updatedAt: iso })),
  }),
  designExport: exportFile,
  profiles: z.object({ profiles: z.array(profileItem.extend({ canDelete: z.boolean() })) }),
  profileUploaded: z.object({
    id,
    samples: z.number().int(),
    summary: recordingSummary,
    fileName: z.string(),
    revision: z.number().int(),
    columns: z.object({ time: z.string(), current: z.string() }),
  }),
  profile: profileItem.extend({
    startS: z.number(),
    endS: z.number(),
    current: z.object({ revision: z.number().int(), summary: recordingSummary }),
    design: recordingDesign,
    series: z.object({
      fromS: z.number(),
      toS: z.number(),
      width: z.number().int(),
      windowSamples: z.number().int(),
      tS: z.array(z.number()),
      currentA: z.array(z.number()),
      clipped: z.array(stretch),
      belowStep: z.array(stretch),
      plan: planSeries.optional(),
    }),
  }),
  deleted,
  units: unitsSummary,
  unit: unitView,
  unitsImported: z.object({ imported: z.number().int(), ids: z.array(id), revision: z.number().int() }),
  calibration: z.object({
    format: z.literal("sensewright-calibration"),
    version: z.literal(1),
    design: z.object({ id, name: z.string() }),
    generatedAt: iso,
    formula: z.string(),
    units: z.array(
      z.object({
        serial: z.string(),
        revision: z.number().int(),
        builtOn: day,
        pass: z.boolean(),
        gain: z.number(),
        offsetV: z.number(),
        residualPercent: z.number().nullable(),
        method: calibration.shape.method,
        points: z.number().int(),
      }),
    ),
  }),
  library: z.object({
    amplifiers: z.array(amplifierPart),
    shunts: z.array(shuntPart),
    adcs: z.array(adcPart),
    meters: z.array(meterPart),
  }),
  amplifier: amplifierPart,
  shunt: shuntPart,
  adc: adcPart,
  meter: meterPart,
  libraryImported: z.object({
    kind: z.enum(["amplifiers", "shunts", "adcs", "meters"]),
    fileName: z.string(),
    created: z.number().int(),
    updated: z.number().int(),
  }),
};

type Bodies = { [K in keyof typeof responses]: z.infer<(typeof responses)[K]> };
export type MeResponse = Bodies["me"];
export type MailChoices = MeResponse["mail"];
export type TeamOfMine = Bodies["me"]["teams"][number];
export type SwitchedTeam = Bodies["switchedTeam"];
export type TokenCreated = Bodies["tokenCreated"];
export type TokenRow = Bodies["tokens"]["tokens"][number];
export type TeamMember = Bodies["team"]["members"][number];
export type InvitationRow = Bodies["invitations"]["invitations"][number];
export type InvitationCreated = Bodies["invitationCreated"];
export type AuditEvent = Bodies["audit"]["events"][number];
export type DesignsPage = Bodies["designList"];
export type DesignRow = DesignsPage["designs"][number];
export type DesignCreated = Bodies["designCreated"];
export type DesignImported = Bodies["designImported"];
/** GET /api/designs/[id]/revisions?a=&b=: two revisions and what changed between them. */
export type RevisionPairDiff = Extract<Bodies["revisions"], { changes: unknown }>;
export type ProfilesBody = Bodies["profiles"];
export type ProfileListItem = ProfilesBody["profiles"][number];
export type ProfileUploaded = Bodies["profileUploaded"];
export type ProfileDetail = Bodies["profile"];
export type UnitsSummaryBody = Bodies["units"];
export type UnitBody = Bodies["unit"];
export type UnitsImported = Bodies["unitsImported"];
export type LibraryBody = Bodies["library"];
export type AmplifierPart = Bodies["amplifier"];
export type ShuntPart = Bodies["shunt"];
export type AdcPart = Bodies["adc"];
export type MeterPart = Bodies["meter"];
export type LibraryImported = Bodies["libraryImported"];
export type InsertionBody = Bodies["insertion"];
export type StatusChange = Bodies["statusChange"];
