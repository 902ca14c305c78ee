// Who may do what: every rule of the workbench's authorization in one table. Routes (through the
// gate), pages and server actions ask `can`; client components get booleans computed from it on
// the server. Team scoping (another team's design is a 404) stays in the queries, which always
// take the caller's team.
import type { DesignStatus, Role } from "@/db/schema";

/** The part of a caller the rules look at. */
export type PolicyCaller = { userId: string; role: Role };

type Rule<R> = {
  /** Roles that may do it at all. */
  roles: readonly Role[];
  /** Does it change anything? (A read-only API token may only do actions that do not.) */
  writes: boolean;
  /** A further condition on the resource, once the role allows it; omitted resource = role only. */
  when?: (caller: PolicyCaller, resource: R) => boolean;
  /** The rule in words, for the 403 message ("save designs"). */
  doing: string;
};

const everyone = ["owner", "designer", "reviewer", "maker"] as const satisfies readonly Role[];
const editors = ["owner", "designer"] as const satisfies readonly Role[];
const judges = ["owner", "reviewer"] as const satisfies readonly Role[];
const owners = ["owner"] as const satisfies readonly Role[];

/** The resource each action may be checked against (undefined: the action takes none). */
export type PolicyResources = {
  "team.read": undefined;
  "team.manage-members": undefined;
  "team.read-log": undefined;
  "team.read-outbox": undefined;
  "team.manage-invitations": undefined;
  "design.read": { status: DesignStatus };
  "design.read-unapproved": undefined;
  "design.create": undefined;
  "design.edit": undefined;
  "design.submit": undefined;
  "design.comment": undefined;
  "design.judge": { authorId: string };
  "profile.upload": undefined;
  "profile.delete": { uploadedBy: string };
  "unit.record": undefined;
  "unit.change": { recordedBy: string };
  "library.read": undefined;
  "library.edit": undefined;
  "engine.use": undefined;
  "account.manage": undefined;
};
export type Action = keyof PolicyResources;

const table: { [A in Action]: Rule<NonNullable<PolicyResources[A]>> } = {
  "team.read": { roles: everyone, writes: false, doing: "see the team" },
  // Owners manage members: change roles and remove people.
  "team.manage-members": { roles: owners, writes: true, doing: "manage members" },
  "team.read-log": { roles: owners, writes: false, doing: "read the team's log" },
  "team.read-outbox": { roles: owners, writes: false, doing: "read the outbox" },
  "team.manage-invitations": { roles: owners, writes: true, doing: "invite people" },
  // Makers see approved designs only (any other design is "not found" for them).
  "design.read": {
    roles: everyone,
    writes: false,
    when: (caller, design) => design.status === "approved" || can(caller, "design.read-unapproved"),
    doing: "read designs",
  },
  "design.read-unapproved": {
    roles: ["owner", "designer", "reviewer"],
    writes: false,
    doing: "see unapproved designs",
  },
  "design.create": { roles: editors, writes: true, doing: "save designs" },
  "design.edit": { roles: editors, writes: true, doing: "edit designs" },
  "design.submit": { roles: editors, writes: true, doing: "submit designs for review" },
  "design.comment": { roles: everyone, writes: true, doing: "comment on designs" },
  // Owners and reviewers approve or return; an author never judges their own revision.
  "design.judge": {
    roles: judges,
    writes: true,
    when: (caller, revision) => revision.authorId !== caller.userId,
    doing: "approve or return designs",
  },
  "profile.upload": { roles: editors, writes: true, doing: "upload current profiles" },
  // Its uploader or an owner deletes a profile.
  "profile.delete": {
    roles: everyone,
    writes: true,
    when: (caller, profile) => profile.uploadedBy === caller.userId || caller.role === "owner",
    doing: "delete current profiles",
  },
  // Built units: owners, designers and makers record them; a maker edits or deletes only the units
  // they recorded, owners and designers any; reviewers read.
  "unit.record": { roles: ["owner", "designer", "maker"], writes: true, doing: "record built units" },
  "unit.change": {
    roles: ["owner", "designer", "maker"],
    writes: true,
    when: (caller, unit) => caller.role !== "maker" || unit.recordedBy === caller.userId,
    doing: "edit or delete built units",
  },
  "library.read": { roles: everyone, writes: false, doing: "read the parts library" },
  "library.edit": { roles: editors, writes: true, doing: "edit the parts library" },
  "engine.use": { roles: everyone, writes: false, doing: "use the engine" },
  "account.manage": { roles: everyone, writes: true, doing: "manage their own account" },
};

export const actions = Object.keys(table) as Action[];

export type ResourceArg<A extends Action> = PolicyResources[A] extends undefined ? [] : [resource?: PolicyResources[A]];

/**
 * May this caller do this? With a resource, the resource's own rule applies too; without one the
 * answer is "does the role allow it at all" (for showing a control before a resource is at hand).
 */
export function can<A extends Action>(caller: PolicyCaller, action: A, ...resource: ResourceArg<A>): boolean {
  const rule = table[action] as Rule<unknown>;
  if (!rule.roles.includes(caller.role)) return false;
  const [res] = resource;
  return res === undefined || !rule.when || rule.when(caller, res);
}

/** The roles an action is open to (for messages and the API description). */
export function rolesFor(action: Action): readonly Role[] {
  return table[action].roles;
}

/** True when the action changes something. */
export function writes(action: Action): boolean {
  return table[action].writes;
}

/** The action in words, as in "Only owners may {doing}". */
export function doingOf(action: Action): string {
  return table[action].doing;
}

/**
 * Not a permission but a way of working: a maker comes to build, so the build sheet leads the
 * design page for them. Kept here so that no page or component reads roles itself.
 */
export function leadsWithBuildSheet(caller: PolicyCaller): boolean {
  return !can(caller, "design.read-unapproved");
}

const roleNames: Record<Role, string> = {
  owner: "owners",
  designer: "designers",
  reviewer: "reviewers",
  maker: "makers",
};

/** "owners and designers", for messages and the API description. */
export function describeRoles(roles: readonly Role[]): string {
  const names = roles.map((r) => roleNames[r]);
  return names.length <= 1 ? (names[0] ?? "nobody") : `${names.slice(0, -1).join(", ")} and ${names.at(-1)}`;
}
