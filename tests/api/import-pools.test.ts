// Small and large files are imported in threads of their own pools (decision 0017): the same tasks,
// with a young generation sized for the file, and a reader thread kept ready only where large files go.
import { afterAll, describe, expect, it } from 'vitest';
import { IFCZIP_TEXT_PER_BYTE, ImportPools, LARGE_FILE_FROM_BYTES, YOUNG_GENERATION_MB, importPoolFor } from '../../server/imports/import-pools.ts';
import { READER_THREAD_FROM_BYTES } from '../../server/ifc/read-model.ts';
import { readerYoungGenerationMb } from '../../server/ifc/reader-thread.ts';

const MB = 1024 * 1024;

describe('which pool imports a file', () => {
  it('goes by the size of the text: .ifc as stored, .ifczip by its estimated text', () => {
    expect(importPoolFor(7.3 * MB, 'ifc')).toBe('small-files');
    expect(importPoolFor(37.6 * MB, 'ifc')).toBe('small-files');
    expect(importPoolFor(LARGE_FILE_FROM_BYTES - 1, 'ifc')).toBe('small-files');
    expect(importPoolFor(LARGE_FILE_FROM_BYTES, 'ifc')).toBe('large-files');
    expect(importPoolFor(154 * MB, 'ifc')).toBe('large-files');
    expect(importPoolFor(Math.ceil(LARGE_FILE_FROM_BYTES / IFCZIP_TEXT_PER_BYTE), 'ifczip')).toBe('large-files');
    expect(importPoolFor(8 * MB, 'ifczip')).toBe('small-files');
  });

  it('draws the line where the reader thread starts helping', () => {
    // Only large-file threads keep a reader thread ready; a file the reader reads with one must go there.
    expect(LARGE_FILE_FROM_BYTES).toBe(READER_THREAD_FROM_BYTES);
  });

  it('gives the reader thread half the young generation of the thread that asks, at least 32 MB', () => {
    expect(readerYoungGenerationMb(YOUNG_GENERATION_MB['large-files'])).toBe(96);
    expect(readerYoungGenerationMb(YOUNG_GENERATION_MB['small-files'])).toBe(32);
    expect(readerYoungGenerationMb(undefined)).toBe(96);
  });
});

describe('the pools\' threads', () => {
  const pools = new ImportPools({ maxThreads: 1, memoryLimitMb: 1024 });
  afterAll(() => pools.destroy());

  type ThreadState = { resourceLimits: { maxYoungGenerationSizeMb: number; maxOldGenerationSizeMb: number }; idleReaderThreads: number };
  const stateOf = (name: 'small-files' | 'large-files') => pools.run<ThreadState>(name, { job: 'thread-state' }, {});

  it('run with their own young generation and the same old-generation limit', async () => {
    const [small, large] = await Promise.all([stateOf('small-files'), stateOf('large-files')]);
    expect(small.resourceLimits.maxYoungGenerationSizeMb).toBe(YOUNG_GENERATION_MB['small-files']);
    expect(large.resourceLimits.maxYoungGenerationSizeMb).toBe(YOUNG_GENERATION_MB['large-files']);
    expect(YOUNG_GENERATION_MB['small-files']).toBeLessThan(YOUNG_GENERATION_MB['large-files']);
    expect(small.resourceLimits.maxOldGenerationSizeMb).toBe(1024);
    expect(large.resourceLimits.maxOldGenerationSizeMb).toBe(1024);
  }, 60_000);

  it('keep a reader thread ready in the large-file pool only', async () => {
    expect((await stateOf('large-files')).idleReaderThreads).toBe(1);
    expect((await stateOf('small-files')).idleReaderThreads).toBe(0);
  }, 60_000);
});
