/** Unit conversions to the engine's SI base (N, mm, MPa). Exact by definition except the ksi/kip figures (7 significant digits). */
export const MM_PER_INCH = 25.4;
export const MPA_PER_KSI = 6.894757;
export const N_PER_KIP = 4448.2216;
