/**
 * The cautions shown on every result screen, report and export. One source of
 * truth so the UI, PDF, CSV and BCF carry the same words.
 */
export const CAUTIONS: readonly string[] = [
  'Results follow the selected standard and edition only; other standards, editions or national annexes give different answers.',
  'Only the stated checks are made: axial tension of the member and a simplified check of its bolted ends. Connection design, combined actions, compression, fatigue, brittle fracture, fire and seismic rules are outside scope.',
  'Inputs come from the building model and may be wrong or missing; every assumed value is shown and must be reviewed.',
  'Results are preliminary and must be verified by a licensed or registered structural engineer before use.',
  'Local codes and project specifications govern.',
];

export const CAUTION_SUMMARY =
  'Checks to the selected standard only, within the stated scope. Verify by a licensed engineer; local codes and project specifications govern.';
