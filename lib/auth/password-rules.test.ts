// Password rules. The length of 12 and "not the e-mail" are the app's rules (common practice, no
// source); the common-password list is the one shipped by @zxcvbn-ts/language-common.
import { describe, expect, it } from "vitest";
import { z } from "zod";
import { isCommonPassword, newPasswordSchema, passwordProblems } from "./password-rules";

const email = "someone.long@example.test";

describe("password rules", () => {
  it("needs at least 12 characters", () => {
    expect(passwordProblems("a7#Kq!v2Zr9", email)).toEqual(["at least 12 characters (this one has 11)"]);
    expect(passwordProblems("a7#Kq!v2Zr9x", email)).toEqual([]);
  });

  it("refuses the account's own e-mail, whatever its case", () => {
    expect(passwordProblems("Someone.Long@Example.test", email)).toEqual(["must not be your e-mail address"]);
  });

  it("refuses passwords on the shipped common list, whatever their case", () => {
    // Both entries are on the list the package ships (checked against its data, not from memory).
    expect(isCommonPassword("qwertyuiop123")).toBe(true);
    expect(passwordProblems("Password1234", email)).toEqual([
      "is on a list of common passwords that are guessed first; choose another",
    ]);
    expect(isCommonPassword("tall-copper-kettle-41")).toBe(false);
  });

  it("puts the plain-words message on the field that carries the password", () => {
    const schema = z.object({ newPassword: newPasswordSchema(email) });
    const parsed = schema.safeParse({ newPassword: "short" });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues[0]).toMatchObject({
      path: ["newPassword"],
      message: "at least 12 characters (this one has 5)",
    });
    expect(schema.safeParse({}).error?.issues[0]?.message).toBe("choose a password");
  });
});
