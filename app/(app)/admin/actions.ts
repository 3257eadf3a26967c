"use server";

import { z } from "zod";
import { formAction } from "@/lib/actions/form-action";
import { addMember, removeMember } from "@/lib/services/memberships";
import { inviteUser } from "@/lib/services/accounts";
import { createUser, updateUser } from "@/lib/services/users";
import { createUserInput, email, inviteUserInput, role, structureCode } from "@/lib/validation";

const userId = z.coerce.number().int().positive();

export const addUserAction = formAction(
  createUserInput,
  async (input, user) => {
    await createUser(user, input);
    return { message: `${input.name} can now sign in as ${input.email}.` };
  },
  "/admin/users",
);

export const inviteUserAction = formAction(
  inviteUserInput,
  async (input, user) => {
    await inviteUser(user, input);
    return { message: `Invitation to ${input.email} queued: ${input.name} chooses a password from the e-mailed link.` };
  },
  "/admin/users",
);

export const changeRoleAction = formAction(
  z.object({ userId, role }),
  async ({ userId, role }, user) => {
    await updateUser(user, userId, { role });
    return { message: `Role changed to ${role}.` };
  },
  "/admin/users",
);

export const setActiveAction = formAction(
  z.object({ userId, active: z.enum(["true", "false"]).transform((value) => value === "true") }),
  async ({ userId, active }, user) => {
    await updateUser(user, userId, { active });
    return { message: active ? "Account reactivated." : "Account deactivated: its sessions and tokens stop working." };
  },
  "/admin/users",
);

const membership = z.object({ email, structure: structureCode });

export const addMemberAction = formAction(
  membership,
  async ({ email, structure }, user) => {
    await addMember(user, email, structure);
    return { message: `${email} added to ${structure}.` };
  },
  "/admin/members",
);

export const removeMemberAction = formAction(
  membership,
  async ({ email, structure }, user) => {
    await removeMember(user, email, structure);
    return { message: `${email} removed from ${structure}.` };
  },
  "/admin/members",
);
