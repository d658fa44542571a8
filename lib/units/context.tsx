"use client";
/** The reader's unit system on the client: set once by the app layout, read by every screen. */
import { createContext, useContext } from "react";
import type { UnitSystem } from "./convert";

const UnitsContext = createContext<UnitSystem>("imperial");

export function UnitsProvider({ system, children }: { system: UnitSystem; children: React.ReactNode }) {
  return <UnitsContext.Provider value={system}>{children}</UnitsContext.Provider>;
}

/** The unit system of the signed-in person (their own choice, else the shop's). */
export function useUnits(): UnitSystem {
  return useContext(UnitsContext);
}
