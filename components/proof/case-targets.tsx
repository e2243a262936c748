"use client";
import { createContext, useContext } from "react";

export interface CaseTarget {
  id: number;
  number: string;
}

const Targets = createContext<readonly CaseTarget[]>([]);

/**
 * Every live case, given once for the whole tree: each case's "move under…" menu reads it from here
 * and builds its options only when opened. (Passing the list to every case made the page grow with
 * the square of the number of cases: 60 cases gave 862 KB.)
 */
export function CaseTargets({ targets, children }: { targets: readonly CaseTarget[]; children: React.ReactNode }) {
  return <Targets.Provider value={targets}>{children}</Targets.Provider>;
}

/** The cases this one may move under: every case except itself and the cases below it. */
export function useMoveTargets(caseId: number, number: string): CaseTarget[] {
  return useContext(Targets).filter((t) => t.id !== caseId && !t.number.startsWith(`${number}.`));
}
