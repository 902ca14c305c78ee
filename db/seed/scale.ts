// A team at the size of a real one's history, for `npm run seed:scale` and the bench: by default
// 10,000 designs, 30,000 revisions, 5,000 reviews and 200 profiles, written in bulk (multi-row inserts
// in one transaction). Every figure is the engine's: a few requirement-and-choice pairs are evaluated
// once and shared. One design has 50 revisions (the bench's design page). Invented data only.
import bcrypt from "bcryptjs";
import { eq } from "drizzle-orm";
import { demoDesigns, demoChoice } from "./designs";
import { evaluateDesign, type EvaluatedPair } from "@/lib/saved-designs/service";
import { profileDesignOf, summarizeProfile } from "@/lib/profile";
import { float64ToBytes } from "../float64-bytes";
import { getDb, type Tx } from "../client";
import {
  designRevisions,
  designs,
  memberships,
  profiles,
  reviews,
  teams,
  users,
  type DesignStatus,
  type Role,
} from "../schema";
import { DEMO_PASSWORD } from "./team";

export const SCALE_TEAM = "Scale bench team";
export const SCALE_ACCOUNTS: readonly { email: string; name: string; role: Role }[] = [
  { email: "owner@scale.example", name: "Scale Owner", role: "owner" },
  { email: "designer@scale.example", name: "Scale Designer", role: "designer" },
  { email: "reviewer@scale.example", name: "Scale Reviewer", role: "reviewer" },
  { email: "maker@scale.example", name: "Scale Maker", role: "maker" },
];

export type ScaleCounts = { designs: number; revisions: number; reviews: number; profiles: number };
export const FULL_SCALE: ScaleCounts = { designs: 10_000, revisions: 30_000, reviews: 5_000, profiles: 200 };
/** The design the bench opens: it carries this many revisions (or fewer when the seed is small). */
export const DEEP_REVISIONS = 50;
export const DEEP_DESIGN_NAME = "Pump controller, long-running revision history";

const PROJECTS = [
  "Soil-moisture logger",
  "Pump controller",
  "Bench adapter",
  "Irrigation valve driver",
  "Weather mast",
  "Battery charger",
  "Greenhouse fan",
  "Cold-store monitor",
  "Tide gauge",
  "Beehive scale",
  "Solar tracker",
  "Door actuator",
];
const VARIANTS = ["supply rail", "radio burst", "motor branch", "sensor bus", "heater", "standby", "charger input"];
const STATUSES: DesignStatus[] = [
  "draft",
  "draft",
  "in-review",
  "approved",
  "approved",
  "returned",
  "draft",
  "approved",
];
const BATCH = 500;

/** Spreads `total` over `n` slots as evenly as whole numbers allow, with `first` fixed for slot 0. */
export function spread(total: number, n: number, first: number): number[] {
  if (n === 1) return [total];
  const head = Math.min(first, total - (n - 1));
  const rest = total - head;
  const out = [head];
  for (let k = 1; k < n; k++) out.push(Math.floor((rest * k) / (n - 1)) - Math.floor((rest * (k - 1)) / (n - 1)));
  return out;
}

async function insertAll<T>(tx: Tx, rows: T[], write: (tx: Tx, chunk: T[]) => Promise<unknown>) {
  for (let k = 0; k < rows.length; k += BATCH) await write(tx, rows.slice(k, k + BATCH));
}

/** A logger-like recording: asleep at a few µA, a burst every 100 ms; `n` samples 100 µs apart. */
function recording(n: number, seed: number) {
  const timesS = new Float64Array(n);
  const currentsA = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    timesS[k] = k * 1e-4;
    currentsA[k] = (k + seed) % 1000 < 20 ? 0.15 + 0.01 * (seed % 3) : 3e-6 * (1 + (k % 7) / 10);
  }
  return { timesS, currentsA };
}

/** Makes the scale team with `counts`; returns its id. Refuses to run twice on one database. */
export async function seedScaleTeam(counts: ScaleCounts = FULL_SCALE): Promise<{ teamId: string }> {
  if (counts.designs < 1 || counts.revisions < counts.designs)
    throw new Error("the scale seed needs at least one design and one revision per design");
  const db = await getDb();
  const existing = await db.select({ id: teams.id }).from(teams).where(eq(teams.name, SCALE_TEAM));
  if (existing.length) throw new Error(`this database already holds "${SCALE_TEAM}": seed an empty directory`);

  // The figures every revision shares: the demo scenarios' own picks, evaluated by the engine once.
  const figures: EvaluatedPair[] = demoDesigns.map((d) => evaluateDesign(d.requirement, demoChoice(d)));
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  const now = Date.now();

  return db.transaction(async (tx) => {
    const [team] = await tx.insert(teams).values({ name: SCALE_TEAM }).returning({ id: teams.id });
    if (!team) throw new Error("scale team not created");
    const userIds = {} as Record<Role, string>;
    for (const a of SCALE_ACCOUNTS) {
      const [u] = await tx
        .insert(users)
        .values({ email: a.email, name: a.name, passwordHash: hash })
        .returning({ id: users.id });
      if (!u) throw new Error("scale user not created");
      userIds[a.role] = u.id;
      await tx.insert(memberships).values({ teamId: team.id, userId: u.id, role: a.role });
    }

    // Designs, newest first in time order; every fifth group of three shares one timestamp (a batch
    // import), so the list's tie-breaker on id is exercised.
    const perDesign = spread(counts.revisions, counts.designs, DEEP_REVISIONS);
    const designRows = perDesign.map((revs, k) => {
      const step = k % 15 < 3 ? Math.floor(k / 15) * 15 : k;
      const updatedAt = new Date(now - step * 37 * 60_000);
      const project = PROJECTS[k % PROJECTS.length]!;
      return {
        teamId: team.id,
        name: k === 0 ? DEEP_DESIGN_NAME : `${project}, ${VARIANTS[k % VARIANTS.length]} ${String(k).padStart(5, "0")}`,
        project,
        status: k === 0 ? ("approved" as const) : STATUSES[k % STATUSES.length]!,
        revision: revs,
        createdBy: userIds.designer,
        createdAt: new Date(updatedAt.getTime() - revs * 3_600_000),
        updatedAt,
      };
    });
    const designIds: string[] = [];
    await insertAll(tx, designRows, async (t, chunk) => {
      const rows = await t.insert(designs).values(chunk).returning({ id: designs.id });
      designIds.push(...rows.map((r) => r.id));
    });

    const revisionRows = designRows.flatMap((d, k) =>
      Array.from({ length: d.revision }, (_, r) => {
        const f = figures[(k + r) % figures.length]!;
        return {
          designId: designIds[k]!,
          revision: r + 1,
          name: d.name,
          requirement: f.requirement,
          choice: f.choice,
          metrics: f.metrics,
          authorId: r % 4 === 3 ? userIds.owner : userIds.designer,
          createdAt: new Date(d.createdAt.getTime() + r * 3_600_000),
        };
      }),
    );
    await insertAll(tx, revisionRows, (t, chunk) => t.insert(designRevisions).values(chunk));

    // Reviews on designs that went through review: approvals on approved ones, returns with a reason
    // on returned ones, comments on the rest; the deep design gets a thread of its own first.
    const reviewed = designRows.map((d, k) => ({ d, k })).filter(({ d }) => d.status !== "draft");
    const order = [0, ...reviewed.map(({ k }) => k).filter((k) => k !== 0)];
    const reviewRows = Array.from({ length: counts.reviews }, (_, n) => {
      const k = n < 20 ? 0 : order[n % order.length]!;
      const d = designRows[k]!;
      const verdict =
        n >= 20 && n < 20 + order.length
          ? d.status === "approved"
            ? ("approve" as const)
            : d.status === "returned"
              ? ("return" as const)
              : ("comment" as const)
          : ("comment" as const);
      const body =
        verdict === "approve"
          ? "Drop and error at the bottom of the range are within target; approved for a first build."
          : verdict === "return"
            ? "The shunt runs warm at full current; take a higher rating or a lower value and resubmit."
            : `Checked the figures at revision ${d.revision}; the error budget at minimum current is the tight one.`;
      return {
        designId: designIds[k]!,
        revision: verdict === "comment" ? 1 + (n % d.revision) : d.revision,
        authorId: userIds.reviewer,
        verdict,
        body,
        createdAt: new Date(d.updatedAt.getTime() - (n % 50) * 60_000),
      };
    });
    await insertAll(tx, reviewRows, (t, chunk) => t.insert(reviews).values(chunk));

    // Profiles, 2,000 samples each, on the newest designs; the summary is the engine's, against the
    // figures of the revision the profile was recorded at.
    const profileRows = Array.from({ length: counts.profiles }, (_, n) => {
      const k = n % Math.min(counts.designs, 100);
      const f = figures[(k + designRows[k]!.revision - 1) % figures.length]!;
      const { timesS, currentsA } = recording(2_000, n);
      return {
        designId: designIds[k]!,
        revision: designRows[k]!.revision,
        fileName: `bench-recording-${String(n).padStart(3, "0")}.csv`,
        samples: timesS.length,
        timesS: float64ToBytes(timesS),
        currentsA: float64ToBytes(currentsA),
        summary: summarizeProfile(timesS, currentsA, profileDesignOf(f)),
        uploadedBy: userIds.designer,
      };
    });
    await insertAll(tx, profileRows, (t, chunk) => t.insert(profiles).values(chunk));
    return { teamId: team.id };
  });
}
