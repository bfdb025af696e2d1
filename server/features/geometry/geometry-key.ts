/** Where a revision's display geometry lives in the file store; `v1` is the file format version. */
export const geometryKey = (revisionId: number): string => `geometry/${revisionId}-v1.bin`;
/** The same file gzipped, sent to clients that take gzip (written by the import, or later on first request). */
export const geometryGzipKey = (revisionId: number): string => `${geometryKey(revisionId)}.gz`;
