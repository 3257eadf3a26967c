import fs from "node:fs";
import { describe, expect, it } from "vitest";
import { ROLES, type Role } from "@/db/schema";
import { ACTIONS, PERMISSIONS, roleAllows, type Action } from "@/lib/auth/permissions";

// The matrix as the foundation issue states the roles: admin does everything; engineers configure
// gauges and limits, acknowledge alerts and manage their structures' tokens; technicians register
// gauges, record zero readings and upload logger files but cannot change limits; owners only read.
// Written out here by hand, cell by cell, so a change to the code's table must be made twice.
const EXPECTED: Record<Action, Record<Role, boolean>> = {
  "structure:view": { admin: true, engineer: true, technician: true, owner: true },
  "structure:create": { admin: true, engineer: true, technician: false, owner: false },
  "gauge:register": { admin: true, engineer: true, technician: true, owner: false },
  "zero:record": { admin: true, engineer: true, technician: true, owner: false },
  // Checking a gauge's bridge with a shunt is field work beside the zero reading (the shunt-check issue).
  "shunt-check:record": { admin: true, engineer: true, technician: true, owner: false },
  "readings:ingest": { admin: true, engineer: true, technician: true, owner: false },
  "limits:edit": { admin: true, engineer: true, technician: false, owner: false },
  "thermal-model:edit": { admin: true, engineer: true, technician: false, owner: false },
  "alert:acknowledge": { admin: true, engineer: true, technician: false, owner: false },
  "load-test:record": { admin: true, engineer: true, technician: false, owner: false },
  // The field records issue: technicians and engineers of the structure add certificates and visits.
  "field-record:add": { admin: true, engineer: true, technician: true, owner: false },
  "token:manage": { admin: true, engineer: true, technician: false, owner: false },
  "audit:view": { admin: true, engineer: true, technician: false, owner: false },
  "users:manage": { admin: true, engineer: false, technician: false, owner: false },
  "members:manage": { admin: true, engineer: false, technician: false, owner: false },
  "mail:read": { admin: true, engineer: false, technician: false, owner: false },
};

describe("permission matrix", () => {
  it("covers every action the code knows", () => {
    expect(Object.keys(EXPECTED).sort()).toEqual(Object.keys(ACTIONS).sort());
  });

  for (const action of Object.keys(EXPECTED) as Action[]) {
    for (const role of ROLES) {
      it(`${role} ${EXPECTED[action][role] ? "may" : "may not"} ${action}`, () => {
        expect(roleAllows(role, action)).toBe(EXPECTED[action][role]);
      });
    }
  }

  it("is printed in the README exactly as the code has it", () => {
    const readme = fs.readFileSync("README.md", "utf8");
    for (const action of Object.keys(ACTIONS) as Action[]) {
      const row = readme.split("\n").find((line) => line.startsWith(`| \`${action}\``));
      expect(row, `README row for ${action}`).toBeDefined();
      const cells = row!.split("|").slice(3, 3 + ROLES.length).map((cell) => cell.trim());
      expect(cells).toEqual(ROLES.map((role) => (PERMISSIONS[role].has(action) ? "yes" : "—")));
    }
  });
});
