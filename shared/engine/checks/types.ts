import type { NetAreaResult } from '../net-area/types.ts';

/** One hand-checkable step: symbol = formula → substituted numbers → value [unit] (clause). */
export interface TraceStep {
  symbol: string;
  description: string;
  formula: string;
  substituted: string;
  value: number;
  unit: string;
  clause: string;
}

/** A value the check assumed rather than read from the input (hole size, γM2, kt, U case …). */
export interface Assumption {
  name: string;
  value: string | number;
  source: string;
}

/** One failure mode: design capacity (φ·Rn, Rn/Ω or R/γ) in N. */
export interface CheckMode {
  name: string;
  capacity: number;
  clause: string;
}

/**
 * Common result of every standard's member check. Forces in N, areas in mm²,
 * tension positive. utilisation = force / designCapacity, null without a positive force.
 */
export interface CheckResult {
  standard: string;
  designCapacity: number;
  utilisation: number | null;
  /** Name of the mode with the smallest capacity. */
  governing: string;
  modes: CheckMode[];
  trace: TraceStep[];
  assumptions: Assumption[];
  warnings: string[];
  grossArea: number;
  netArea: number;
  net: NetAreaResult;
}
