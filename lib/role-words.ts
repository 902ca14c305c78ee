// What each team role may do, in words: shown when an owner changes a role, and in the mail that
// tells the member. Kept beside, not inside, the policy: the policy decides, these words explain.
import type { Role } from "@/db/schema";

/** What a member with the role does, as a phrase after "they will" / "you will". */
export const roleMeans: Record<Role, string> = {
  owner: "run the team: invite and remove members, change roles, approve designs",
  designer: "create and edit designs and submit them for review",
  reviewer: "approve or return designs, and no longer edit them",
  maker: "see approved designs only, to build from",
};
