// The request thread's end of an import worker's member slices, over a real MessageChannel.
import { describe, expect, it } from 'vitest';
import { MessageChannel, type MessagePort } from 'node:worker_threads';
import { MemberSliceStream } from '../../server/imports/member-slice-stream';
import type { StorableMember } from '../../server/imports/member-slices';

const slice = (...ids: string[]) => ids.map((globalId) => ({ globalId }) as StorableMember);

function streamOn(): { stream: MemberSliceStream; worker: MessagePort; acks: () => number } {
  const channel = new MessageChannel();
  const stream = new MemberSliceStream(channel.port1);
  channel.port1.on('message', (m) => stream.take(m));
  let acks = 0;
  channel.port2.on('message', (m: { taken?: boolean }) => m.taken && acks++);
  return { stream, worker: channel.port2, acks: () => acks };
}

async function collect(stream: MemberSliceStream): Promise<string[][]> {
  const out: string[][] = [];
  for await (const s of stream) out.push(s.members.map((m) => m.globalId));
  return out;
}

describe('member slice stream', () => {
  it('yields every slice in order, acknowledging each once the next is asked for, then ends at the end message', async () => {
    const { stream, worker, acks } = streamOn();
    const slices = stream[Symbol.asyncIterator]();
    worker.postMessage({ status: 'checking', progress: 0.5 });
    worker.postMessage({ members: slice('a', 'b'), capacities: [{ key: 0, bodyJson: '{"k":0}' }] });
    worker.postMessage({ members: slice('c'), capacities: [] });
    const first = (await slices.next()).value;
    expect(first?.members.map((m: StorableMember) => m.globalId)).toEqual(['a', 'b']);
    expect(first?.capacities).toEqual([{ key: 0, bodyJson: '{"k":0}' }]);
    expect((await slices.next()).value?.members.map((m: StorableMember) => m.globalId)).toEqual(['c']);
    const last = slices.next();
    await new Promise((r) => setTimeout(r, 20));
    expect(acks()).toBe(2);
    worker.postMessage({ end: true, count: 3 });
    // Closing right after the end (as the worker does) loses nothing.
    worker.close();
    expect((await last).done).toBe(true);
  });

  it('fails when the port closes before the end was announced', async () => {
    const { stream, worker } = streamOn();
    const read = collect(stream);
    worker.postMessage({ members: slice('a') });
    worker.close();
    await expect(read).rejects.toThrow(/stopped before handing over/);
  });

  it('fails with the error it is given, and ignores one that comes after the end', async () => {
    const first = streamOn();
    const read = collect(first.stream);
    first.worker.postMessage({ members: slice('a') });
    await new Promise((r) => setTimeout(r, 20));
    first.stream.fail(new Error('task failed'));
    await expect(read).rejects.toThrow('task failed');
    first.worker.close();

    const second = streamOn();
    second.worker.postMessage({ members: slice('a') });
    second.worker.postMessage({ end: true, count: 1 });
    await new Promise((r) => setTimeout(r, 20));
    second.stream.fail(new Error('too late'));
    expect(await collect(second.stream)).toEqual([['a']]);
    second.worker.close();
  });
});
