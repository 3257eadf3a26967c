"use server";

import { z } from "zod";
import { formAction } from "@/lib/actions/form-action";
import { setUnits } from "@/lib/services/users";

export const unitsAction = formAction(
  z.object({ units: z.enum(["si", "us"]) }),
  async ({ units }, user) => {
    await setUnits(user, units);
    return { message: units === "us" ? "Showing ksi and °F." : "Showing MPa and °C." };
  },
  "/",
);
