import { insertToken, listTokens } from "@/db/queries/tokens";
import { createTokenSchema, tokenExpiry } from "@/lib/auth/account-schemas";
import { apiRoute } from "@/lib/auth/gate";
import { newSecret } from "@/lib/auth/tokens";
import { HttpError, json } from "@/lib/http";

/** The caller's own tokens (every team of theirs), never the secret. */
export const GET = apiRoute({ action: "account.manage", doing: "list their tokens" }, async ({ caller }) => ({
  tokens: (await listTokens(caller.userId)).map((t) => ({
    ...t,
    createdAt: t.createdAt.toISOString(),
    expiresAt: t.expiresAt?.toISOString() ?? null,
    lastUsedAt: t.lastUsedAt?.toISOString() ?? null,
  })),
}));

/** 201 {id, token}: the secret, shown this once. Bound to the caller's current team. */
export const POST = apiRoute(
  { action: "account.manage", doing: "create tokens", body: createTokenSchema },
  async ({ caller, body }) => {
    // A token cannot mint tokens: a leaked one must not be able to outlive its own revocation.
    if (caller.via === "token")
      throw new HttpError(403, "Create tokens while signed in (on /account), not with a token.");
    const { secret, secretHash, hint } = newSecret();
    const expiresAt = tokenExpiry(body);
    const { id, createdAt } = await insertToken({
      userId: caller.userId,
      teamId: caller.teamId,
      name: body.name,
      access: body.access,
      secretHash,
      hint,
      expiresAt,
    });
    return json(
      {
        id,
        token: secret,
        name: body.name,
        access: body.access,
        teamId: caller.teamId,
        createdAt: createdAt.toISOString(),
        expiresAt: expiresAt?.toISOString() ?? null,
      },
      { status: 201, headers: { "cache-control": "no-store" } },
    );
  },
);
