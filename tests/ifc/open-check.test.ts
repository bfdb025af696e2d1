// web-ifc's checking thread (server/ifc/open-check.ts): kept for the next file once it has
// answered, ended when stopped or when it fails.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { idleCheckingThreads, startOpenCheck } from '../../server/ifc/open-check.ts';

const SAMPLE = path.resolve(import.meta.dirname, '../../samples/kestrel-yard-shed.ifc');

describe('the checking thread', () => {
  it('answers the same for a second file on the thread the first one left', async () => {
    const bytes = new Uint8Array(readFileSync(SAMPLE));
    const before = idleCheckingThreads();
    const first = await startOpenCheck(bytes).answer;
    expect(first.ok).toBe(true);
    expect(idleCheckingThreads()).toBe(before + 1);
    const second = await startOpenCheck(bytes).answer;
    // The idle thread was taken and given back: no second thread.
    expect(idleCheckingThreads()).toBe(before + 1);
    expect(second).toEqual(first);
  });

  it('answers a file web-ifc cannot open, and keeps the thread', async () => {
    const idleBefore = idleCheckingThreads();
    const answer = await startOpenCheck(new TextEncoder().encode('not a model at all')).answer;
    expect(answer.ok).toBe(false);
    expect(idleCheckingThreads()).toBe(Math.max(idleBefore, 1));
  });

  it('ends a thread stopped before it answers (its answer: not ok), and does not keep it', async () => {
    const big = new Uint8Array(readFileSync(SAMPLE));
    const idleBefore = idleCheckingThreads();
    const check = startOpenCheck(big);
    check.stop();
    const answer = await check.answer;
    expect(answer.ok).toBe(false);
    // The thread it took (the idle one, if there was one) is gone, not given back.
    expect(idleCheckingThreads()).toBe(Math.max(idleBefore - 1, 0));
  });
});
