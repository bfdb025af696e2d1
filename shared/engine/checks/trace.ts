import type { Assumption, CheckMode, TraceStep } from './types.ts';

/** Numbers as an engineer writes them by hand: up to 4 significant decimals, no float noise. */
export function fmt(v: number): string {
  // Whole numbers (areas, strengths, most lengths) need no rounding: toFixed is the slow part.
  if (Number.isInteger(v) && Math.abs(v) < 1e21) return String(v);
  if (!Number.isFinite(v)) return String(v);
  const a = Math.abs(v);
  const digits = a >= 1000 ? 0 : a >= 100 ? 1 : a >= 1 ? 3 : 4;
  return String(Number(v.toFixed(digits)));
}

/** Collects trace steps, assumptions, warnings and modes while a check runs. */
export class Recorder {
  readonly trace: TraceStep[] = [];
  readonly assumptions: Assumption[] = [];
  readonly warnings: string[] = [];
  readonly modes: CheckMode[] = [];

  /** Record a step and return its value so formulas read naturally. */
  step(symbol: string, description: string, formula: string, substituted: string, value: number, unit: string, clause: string): number {
    this.trace.push({ symbol, description, formula, substituted, value, unit, clause });
    return value;
  }

  assume(name: string, value: string | number, source: string): void {
    this.assumptions.push({ name, value, source });
  }

  warn(message: string): void {
    if (!this.warnings.includes(message)) this.warnings.push(message);
  }

  /** Add a failure mode (capacity in N). */
  mode(name: string, capacity: number, clause: string): number {
    this.modes.push({ name, capacity, clause });
    return capacity;
  }
}
