// Walks the whole policy table: every action × every role, with and without the resource, against
// the rules as written in the HTTP contract (/work/shared/API.md "Designs and their review" and the
// routes' role columns) — written out here independently of the table in policy.ts.
import { describe, expect, it } from "vitest";
import { roles, type Role } from "@/db/schema";
import { actions, can, leadsWithBuildSheet, rolesFor, writes, type Action } from "./policy";

const me = "11111111-1111-4111-8111-111111111111";
const someoneElse = "22222222-2222-4222-8222-222222222222";
const as = (role: Role) => ({ userId: me, role });

const all: Role[] = ["owner", "designer", "reviewer", "maker"];
/** Who the role alone lets do each action (API.md's "who" column). */
const expectedRoles: Record<Action, Role[]> = {
  "team.read": all,
  "team.manage-members": ["owner"],
  "team.read-log": ["owner"],
  "team.read-outbox": ["owner"],
  "team.manage-invitations": ["owner"],
  "design.read": all,
  "design.read-unapproved": ["owner", "designer", "reviewer"],
  "design.create": ["owner", "designer"],
  "design.edit": ["owner", "designer"],
  "design.submit": ["owner", "designer"],
  "design.comment": all,
  "design.judge": ["owner", "reviewer"],
  "profile.upload": ["owner", "designer"],
  "profile.delete": all,
  "unit.record": ["owner", "designer", "maker"],
  "unit.change": ["owner", "designer", "maker"],
  "library.read": all,
  "library.edit": ["owner", "designer"],
  "engine.use": all,
  "account.manage": all,
};
const readOnly: Action[] = [
  "team.read",
  "team.read-log",
  "team.read-outbox",
  "design.read",
  "design.read-unapproved",
  "library.read",
  "engine.use",
];

describe("the policy table", () => {
  it("lists exactly the actions this test knows", () => {
    expect([...actions].sort()).toEqual(Object.keys(expectedRoles).sort());
  });

  for (const action of actions) {
    it(`${action}: the role rule`, () => {
      for (const role of roles) {
        expect(can(as(role), action as "team.read"), `${role} → ${action}`).toBe(expectedRoles[action].includes(role));
      }
      expect([...rolesFor(action)].sort()).toEqual([...expectedRoles[action]].sort());
      expect(writes(action), `${action} writes`).toBe(!readOnly.includes(action));
    });
  }
});

describe("rules on the resource", () => {
  it("makers see approved designs only; everyone else sees every status", () => {
    for (const role of roles) {
      for (const status of ["draft", "in-review", "approved", "returned"] as const) {
        expect(can(as(role), "design.read", { status }), `${role} reads a ${status} design`).toBe(
          role !== "maker" || status === "approved",
        );
      }
    }
  });

  it("an author never approves or returns their own revision", () => {
    expect(can(as("owner"), "design.judge", { authorId: me })).toBe(false);
    expect(can(as("reviewer"), "design.judge", { authorId: me })).toBe(false);
    expect(can(as("owner"), "design.judge", { authorId: someoneElse })).toBe(true);
    expect(can(as("reviewer"), "design.judge", { authorId: someoneElse })).toBe(true);
    // The role rule still holds on someone else's revision.
    expect(can(as("designer"), "design.judge", { authorId: someoneElse })).toBe(false);
    expect(can(as("maker"), "design.judge", { authorId: someoneElse })).toBe(false);
  });

  it("the uploader or an owner deletes a profile", () => {
    for (const role of roles) {
      expect(can(as(role), "profile.delete", { uploadedBy: me }), `${role}, own upload`).toBe(true);
      expect(can(as(role), "profile.delete", { uploadedBy: someoneElse }), `${role}, another's upload`).toBe(
        role === "owner",
      );
    }
  });

  it("a maker changes only the units they recorded; owners and designers any; reviewers none", () => {
    for (const role of roles) {
      expect(can(as(role), "unit.change", { recordedBy: me }), `${role}, own unit`).toBe(role !== "reviewer");
      expect(can(as(role), "unit.change", { recordedBy: someoneElse }), `${role}, another's unit`).toBe(
        role === "owner" || role === "designer",
      );
    }
  });

  it("the build sheet leads the page for makers only", () => {
    expect(roles.filter((r) => leadsWithBuildSheet(as(r)))).toEqual(["maker"]);
  });
});
