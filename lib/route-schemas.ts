// Request schemas of the routes that have no feature module of their own. The routes validate with
// them and the API description (lib/api-description) is generated from them, so the two agree.
import { z } from "zod";
import { roleSchema } from "@/lib/team-schemas";
import { textField } from "@/lib/text-field";
import { partKinds } from "@/lib/library/schema";
import { verdictEnum } from "@/db/schema";

const verdicts = verdictEnum.enumValues;
export const reviewBodySchema = z
  .object({
    verdict: z.enum(verdicts, { error: `verdict must be one of: ${verdicts.join(", ")}` }),
    body: textField({ label: "body", max: 10_000, multiline: true }).default(""),
    parentId: z.uuid({ error: "parentId: expected the id of a comment on this design" }).nullish(),
    revision: z.number().int().min(1).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.verdict !== "approve" && !v.body.trim())
      ctx.addIssue({
        code: "custom",
        path: ["body"],
        message: v.verdict === "return" ? "Say why the design goes back" : "A comment needs some text",
      });
    if (v.verdict !== "comment" && v.parentId)
      ctx.addIssue({
        code: "custom",
        path: ["parentId"],
        message: "Only comments are replies; a verdict stands on its own",
      });
  });

export const submitBodySchema = z.object({ revision: z.number().int().min(1).optional() });

const seconds = (label: string) =>
  z.coerce
    .number({ error: `${label}: expected a time in seconds` })
    .refine(Number.isFinite, { error: `${label}: expected a finite time in seconds` })
    .optional();

export const profileWindowQuery = z.object({
  from: seconds("from"),
  to: seconds("to"),
  width: z.coerce
    .number({ error: "width: expected a number of pixels" })
    .int({ error: "width must be a whole number of pixels" })
    .min(10, { error: "width must be at least 10" })
    .max(4000, { error: "width must be at most 4000" })
    .default(800),
});

/** `?offset=0` leaves the amplifier offset out of a netlist. */
export const netlistQuery = z.object({
  offset: z.enum(["0", "1"], { error: 'offset: expected "0" (leave the offset out) or "1"' }).optional(),
});

/** A saved design's netlist: as above, and for a range plan one range's deck alone (1-based). */
export const designNetlistQuery = netlistQuery.extend({
  // Left out: every range's deck.
  range: z.coerce
    .number({ error: "range: expected a range number such as 1" })
    .int({ error: "range: expected a whole range number such as 1" })
    .min(1, { error: "range: ranges are numbered from 1" })
    .optional(),
});

const positiveFinite = (label: string) =>
  z
    .number({ error: `${label}: expected a number in SI units` })
    .refine((v) => Number.isFinite(v) && v > 0, { error: `${label} must be a finite number above zero` });

export const netlistCandidateSchema = z.object(
  { shuntOhms: positiveFinite("Shunt (ohms)"), gain: positiveFinite("Gain") },
  { error: "Candidate: expected { shuntOhms, gain }" },
);

const revisionNumber = z.coerce
  .number({ error: "expected a revision number" })
  .int({ error: "expected a whole revision number" })
  .min(1, { error: "revisions start at 1" });
export const revisionsQuery = z.object({ a: revisionNumber.optional(), b: revisionNumber.optional() });

export const auditQuery = z.object({
  limit: z.coerce
    .number()
    .int()
    .min(1, { error: "limit: at least 1" })
    .max(1000, { error: "limit: at most 1000" })
    .default(200),
});

export const libraryKindSchema = z.enum(partKinds, {
  error: 'expected "amplifiers", "shunts", "adcs" or "meters"',
});
export const libraryExportQuery = z.object({ kind: libraryKindSchema });

export const invitationBodySchema = z
  .object({
    email: z
      .string({ error: "email: expected an e-mail address" })
      .trim()
      .toLowerCase()
      .pipe(z.email({ error: "email: not an e-mail address" })),
    role: roleSchema.optional(),
    newTeam: textField({
      label: "newTeam",
      min: 1,
      minMessage: "newTeam: give the new team a name",
      max: 120,
    }).optional(),
  })
  .superRefine((v, ctx) => {
    if (!v.newTeam && !v.role)
      ctx.addIssue({ code: "custom", path: ["role"], message: "Choose the role the new member gets" });
    if (v.newTeam && v.role && v.role !== "owner")
      ctx.addIssue({ code: "custom", path: ["role"], message: "The first member of a new team is its owner" });
  });
