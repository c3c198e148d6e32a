import { describe, expect, it } from 'vitest';
import { readBodyWithin } from '../../src/lib/server/http';

/** A request whose body arrives in the given chunks with no Content-Length, counting how many were read. */
function chunkedRequest(chunkSizes: number[]) {
  const seen = { pulled: 0, cancelled: false };
  let next = 0;
  const body = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (next === chunkSizes.length) return controller.close();
      seen.pulled += 1;
      controller.enqueue(new Uint8Array(chunkSizes[next++]!));
    },
    cancel() {
      seen.cancelled = true;
    },
  });
  const request = new Request('http://app.test/upload', { method: 'POST', body, duplex: 'half' } as RequestInit);
  return { request, seen };
}

describe('readBodyWithin', () => {
  it('returns the bytes of a body within the limit', async () => {
    const { request } = chunkedRequest([3, 4]);
    const body = await readBodyWithin(request, 10);
    expect(body.kind === 'read' && body.bytes.byteLength).toBe(7);
  });

  it('refuses an announced length over the limit without reading a byte', async () => {
    const request = new Request('http://app.test/upload', { method: 'POST', body: new Uint8Array(11), headers: { 'content-length': '11' } });
    expect(await readBodyWithin(request, 10)).toEqual({ kind: 'over', announced: true, drained: false });
    expect(request.bodyUsed).toBe(false);
  });

  it('reads and drops the rest of an unannounced oversized body, so the sender can read the answer', async () => {
    const { request, seen } = chunkedRequest([6, 6, 6, 6]);
    expect(await readBodyWithin(request, 10, 100)).toEqual({ kind: 'over', announced: false, drained: true });
    expect(seen).toEqual({ pulled: 4, cancelled: false });
  });

  it('stops and cancels once the part past the limit exceeds what it will drain', async () => {
    const { request, seen } = chunkedRequest([6, 6, 6, 6, 6, 6]);
    // 12 read, 2 of them past the limit; then 6 + 6 more makes 14 past it, over a drain of 8.
    expect(await readBodyWithin(request, 10, 8)).toEqual({ kind: 'over', announced: false, drained: false });
    expect(seen.pulled).toBeLessThan(6);
    expect(seen.cancelled).toBe(true);
  });
});
