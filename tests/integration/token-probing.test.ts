import { describe, expect, it } from "vitest";
import { createToken, revokeToken } from "@/lib/services/tokens";
import { makeStructure, makeUser } from "./helpers";

// Common practice (OWASP Authorization Cheat Sheet): check the permission before looking up what
// the request names, so a refusal tells nothing about what exists.
describe("tokens tell nothing to those who may not manage them", () => {
  it("an engineer creating a user token is refused alike for an existing and a made-up e-mail", async () => {
    const engineer = await makeUser("engineer", "eng@test.example");
    await makeUser("owner", "exists@test.example");
    const refusal = (email: string) => createToken(engineer, { kind: "user", email }, "probe").catch((e: unknown) => e);
    const [existing, madeUp] = await Promise.all([refusal("exists@test.example"), refusal("nobody@test.example")]);
    expect(existing).toMatchObject({ code: "forbidden" });
    expect(madeUp).toMatchObject({ code: "forbidden", message: (existing as Error).message });
  });

  it("revoking answers 'not found' alike for a token one may not manage and one that does not exist", async () => {
    const engineer = await makeUser("engineer", "eng2@test.example");
    await makeUser("owner", "holder@test.example");
    await makeStructure("OTHER-1");
    const userToken = await createToken(null, { kind: "user", email: "holder@test.example" }, "holder's");
    const foreignLogger = await createToken(null, { kind: "logger", structureCode: "OTHER-1" }, "not a member's");
    const refusal = (id: number) => revokeToken(engineer, id).catch((e: unknown) => e);
    const answers = await Promise.all([refusal(userToken.id), refusal(foreignLogger.id), refusal(987_654)]);
    expect(answers.map((a) => [(a as { code: string }).code, (a as Error).message])).toEqual([
      ["not_found", "Token was not found."],
      ["not_found", "Token was not found."],
      ["not_found", "Token was not found."],
    ]);
    const owner = await makeUser("owner", "owner3@test.example");
    await expect(revokeToken(owner, userToken.id)).rejects.toMatchObject({ code: "forbidden" });
    await expect(revokeToken(owner, 987_654)).rejects.toMatchObject({ code: "forbidden" });
  });
});
