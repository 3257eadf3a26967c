import { parseArgs } from "node:util";
import { z } from "zod";
import { closeDb } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { AppError } from "@/lib/errors";
import { addMember } from "@/lib/services/memberships";
import { createToken } from "@/lib/services/tokens";
import { createUser, setPasswordFromCommandLine } from "@/lib/services/users";
import { createUserInput, email, password, structureCode, tokenName, issuesOf } from "@/lib/validation";

const USAGE = `Usage:
  npm run admin -- user add --email E --name N --role admin|engineer|technician|owner --password P
  npm run admin -- member add --email E --structure CODE
  npm run admin -- user password --email E --password P   (sets it and ends that user's sessions)
  npm run admin -- token create --email E --name LABEL        (user token)
  npm run admin -- token create --structure CODE --name LABEL (logger token)
The new token is printed alone on the last line. DATABASE_URL selects the database, as for the app.`;

const { positionals, values } = parseArgs({
  allowPositionals: true,
  options: {
    email: { type: "string" },
    name: { type: "string" },
    role: { type: "string" },
    password: { type: "string" },
    structure: { type: "string" },
  },
});

function parse<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const result = schema.safeParse(value);
  if (!result.success) {
    const lines = issuesOf(result.error).map((i) => `  --${i.path || "arguments"}: ${i.message}`);
    throw new AppError("validation_failed", `Check these options:\n${lines.join("\n")}`);
  }
  return result.data;
}

async function run(command: string): Promise<void> {
  switch (command) {
    case "user add": {
      const input = parse(createUserInput, values);
      const user = await createUser(null, input);
      console.log(`User ${user.email} (${user.role}) created.`);
      return;
    }
    case "user password": {
      const input = parse(z.object({ email, password }), values);
      await setPasswordFromCommandLine(input.email, input.password);
      console.log(`Password of ${input.email} set; every session of theirs has ended.`);
      return;
    }
    case "member add": {
      const input = parse(z.object({ email, structure: structureCode }), values);
      await addMember(null, input.email, input.structure);
      console.log(`${input.email} is now a member of ${input.structure}.`);
      return;
    }
    case "token create": {
      if (Boolean(values.email) === Boolean(values.structure)) {
        throw new AppError("validation_failed", "Give either --email (a user token) or --structure (a logger token), not both.");
      }
      const owner = values.email
        ? { kind: "user" as const, email: parse(email, values.email) }
        : { kind: "logger" as const, structureCode: parse(structureCode, values.structure) };
      const input = parse(z.object({ name: tokenName }), values);
      const issued = await createToken(null, owner, input.name);
      console.log(`${owner.kind === "user" ? "User" : "Logger"} token "${input.name}" created; it is shown only now:`);
      console.log(issued.token);
      return;
    }
    default:
      console.error(USAGE);
      process.exitCode = 2;
  }
}

try {
  await migrateDatabase();
  await run(positionals.join(" "));
} catch (error) {
  if (!(error instanceof AppError)) throw error;
  console.error(error.message);
  process.exitCode = 1;
} finally {
  closeDb();
}
