import { getAccount, listTeamsOf, updateAccount } from "@/db/queries/users";
import { updateAccountSchema } from "@/lib/auth/account-schemas";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError } from "@/lib/http";

async function me(userId: string, currentTeamId: string) {
  const [account, teams] = await Promise.all([getAccount(userId), listTeamsOf(userId)]);
  if (!account) throw new HttpError(401, "Sign in first.");
  return { user: account.user, teams, currentTeamId, mail: account.mail };
}

/** {user: {id, email, name}, teams: [{id, name, role}], currentTeamId, mail: {submitted, returned, approved, comments}}. */
export const GET = apiRoute({ action: "account.manage", doing: "see their account" }, async ({ caller }) =>
  me(caller.userId, caller.teamId),
);

/** {name?, mail?: {submitted?, returned?, approved?, comments?}} → the account as GET shows it. */
export const PATCH = apiRoute(
  { action: "account.manage", doing: "change their account", body: updateAccountSchema },
  async ({ caller, body }) => {
    await updateAccount(caller.userId, caller.teamId, body);
    return me(caller.userId, caller.teamId);
  },
);
