import { useSyncExternalStore } from 'react';

/**
 * Units of display. The server and the engine work in N, mm, mm² and MPa; people read
 * SI (kN, mm, mm², MPa) by default or US customary (kip, in, in², ksi) if they chose it.
 * The choice is per person and per browser (localStorage), and every view reads it
 * through useUnits() so a figure never appears without its unit.
 * Tension is positive throughout.
 */

export type UnitSystem = 'si' | 'us';
export const UNIT_SYSTEMS: readonly UnitSystem[] = ['si', 'us'];
export const UNIT_SYSTEM_LABELS: Record<UnitSystem, string> = {
  si: 'SI (kN, mm, MPa)',
  us: 'US customary (kip, in, ksi)',
};

const STORAGE_KEY = 'gaugeline.units';
const NEWTONS_PER_KIP = 4448.2216152605;
const MM_PER_INCH = 25.4;
const MPA_PER_KSI = 6.894757293168361;

/** A figure ready to show: the number as text and its unit (which views set in muted ink). */
export interface Measure {
  value: string;
  unit: string;
  /** "96.4 kN": for titles, aria labels and plain text. */
  text: string;
}

export type Quantity = 'force' | 'length' | 'area' | 'stress';

interface UnitSpec {
  unit: string;
  /** SI base value (N, mm, mm², MPa) → display value. */
  from: (si: number) => number;
  /** Display value → SI base value. */
  to: (shown: number) => number;
  decimals: number;
}

export const UNIT_SPECS: Record<UnitSystem, Record<Quantity, UnitSpec>> = {
  si: {
    force: { unit: 'kN', from: (n) => n / 1000, to: (v) => v * 1000, decimals: 1 },
    length: { unit: 'mm', from: (mm) => mm, to: (v) => v, decimals: 0 },
    area: { unit: 'mm²', from: (a) => a, to: (v) => v, decimals: 0 },
    stress: { unit: 'MPa', from: (s) => s, to: (v) => v, decimals: 0 },
  },
  us: {
    force: { unit: 'kip', from: (n) => n / NEWTONS_PER_KIP, to: (v) => v * NEWTONS_PER_KIP, decimals: 1 },
    length: { unit: 'in', from: (mm) => mm / MM_PER_INCH, to: (v) => v * MM_PER_INCH, decimals: 2 },
    area: { unit: 'in²', from: (a) => a / (MM_PER_INCH * MM_PER_INCH), to: (v) => v * MM_PER_INCH * MM_PER_INCH, decimals: 2 },
    stress: { unit: 'ksi', from: (s) => s / MPA_PER_KSI, to: (v) => v * MPA_PER_KSI, decimals: 1 },
  },
};

const numberFormats = new Map<number, Intl.NumberFormat>();
function fixed(value: number, decimals: number): string {
  let f = numberFormats.get(decimals);
  if (!f) {
    f = new Intl.NumberFormat('en-GB', { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
    numberFormats.set(decimals, f);
  }
  // Avoid "-0.0".
  const out = f.format(value);
  return /^-0(\.0+)?$/.test(out) ? out.slice(1) : out;
}

/** Format a value given in SI base units (N, mm, mm², MPa) in the chosen system. */
export function measure(system: UnitSystem, quantity: Quantity, si: number, decimals?: number): Measure {
  const spec = UNIT_SPECS[system][quantity];
  const value = fixed(spec.from(si), decimals ?? spec.decimals);
  return { value, unit: spec.unit, text: `${value} ${spec.unit}` };
}

/** Utilisation (design action ÷ design capacity): always two decimals, no unit. */
export function formatUtilisation(u: number): string {
  return fixed(u, 2);
}

/** A plain number with a fixed count of decimals, grouped in thousands. */
export function formatNumber(value: number, decimals = 0): string {
  return fixed(value, decimals);
}

/** The quantity an engine unit string stands for, if it is one we convert. */
export function quantityOfUnit(unit: string): Quantity | null {
  switch (unit) {
    case 'N':
      return 'force';
    case 'mm':
      return 'length';
    case 'mm²':
    case 'mm2':
      return 'area';
    case 'MPa':
    case 'N/mm²':
      return 'stress';
    default:
      return null;
  }
}

// --- the stored choice -------------------------------------------------------

const listeners = new Set<() => void>();

function read(): UnitSystem {
  try {
    return window.localStorage.getItem(STORAGE_KEY) === 'us' ? 'us' : 'si';
  } catch {
    return 'si';
  }
}

export function setUnitSystem(system: UnitSystem): void {
  try {
    window.localStorage.setItem(STORAGE_KEY, system);
  } catch {
    // storage unavailable (private mode): the choice lasts for this page only
    memory = system;
  }
  listeners.forEach((l) => l());
}

let memory: UnitSystem | null = null;

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  const onStorage = (event: StorageEvent) => {
    if (event.key === STORAGE_KEY) listener();
  };
  window.addEventListener('storage', onStorage);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('storage', onStorage);
  };
}

const snapshot = () => memory ?? read();

export interface Units {
  system: UnitSystem;
  setSystem: (system: UnitSystem) => void;
  force: (newtons: number, decimals?: number) => Measure;
  length: (mm: number, decimals?: number) => Measure;
  area: (mm2: number, decimals?: number) => Measure;
  stress: (mpa: number, decimals?: number) => Measure;
  /** Unit label of a quantity in the chosen system, e.g. for a form label. */
  unitOf: (quantity: Quantity) => string;
  /** A value typed in the chosen system → SI base units (N, mm, mm², MPa). */
  toSI: (quantity: Quantity, shown: number) => number;
  /** SI base value → the chosen system, unrounded (to prefill inputs). */
  fromSI: (quantity: Quantity, si: number) => number;
}

export function unitsFor(system: UnitSystem): Units {
  return {
    system,
    setSystem: setUnitSystem,
    force: (n, d) => measure(system, 'force', n, d),
    length: (mm, d) => measure(system, 'length', mm, d),
    area: (a, d) => measure(system, 'area', a, d),
    stress: (s, d) => measure(system, 'stress', s, d),
    unitOf: (q) => UNIT_SPECS[system][q].unit,
    toSI: (q, v) => UNIT_SPECS[system][q].to(v),
    fromSI: (q, v) => UNIT_SPECS[system][q].from(v),
  };
}

const cache: Record<UnitSystem, Units> = { si: unitsFor('si'), us: unitsFor('us') };

/** The person's unit system and formatters that follow it. */
export function useUnits(): Units {
  const system = useSyncExternalStore(subscribe, snapshot, () => 'si' as UnitSystem);
  return cache[system];
}
