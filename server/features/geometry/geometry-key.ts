/** Where a revision's display geometry lives in the file store; `v1` is the file format version. */
export const geometryKey = (revisionId: number): string => `geometry/${revisionId}-v1.bin`;
