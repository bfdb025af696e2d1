/** US customary → SI conversions for tests built on US worked examples. */
export const IN = 25.4; // mm per inch
export const IN2 = IN * IN; // mm² per in²
export const KSI = 6.894757; // MPa per ksi
export const KIP = 4448.2216; // N per kip
