"use client";

import { createContext, useContext } from "react";
import type { UnitSystem } from "@/lib/units";

const UnitsContext = createContext<UnitSystem>("si");

/** The signed-in person's display units, for charts and tables drawn in the browser. */
export function UnitsProvider({ units, children }: { units: UnitSystem; children: React.ReactNode }) {
  return <UnitsContext.Provider value={units}>{children}</UnitsContext.Provider>;
}

export function useUnits(): UnitSystem {
  return useContext(UnitsContext);
}
