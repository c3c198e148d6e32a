import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { createHash } from 'node:crypto';
import { canonicalJson, sha256, sha256Text } from '~/lib/procedure/checksum';
import { procedureChecksum } from '~/lib/procedure/validate';
import { sumpMini } from './fixtures/sump-mini';

// Reference implementation for the random checks: Node's built-in SHA-256.
const nodeSha256 = (data: string | Uint8Array) => createHash('sha256').update(data).digest('hex');

describe('sha256', () => {
  it('matches the published test vectors', () => {
    // FIPS 180-2, Appendix B.1 (one-block message "abc")
    expect(sha256Text('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    // FIPS 180-2, Appendix B.2 (multi-block message)
    expect(sha256Text('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')).toBe(
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    );
    // FIPS 180-2, Appendix B.3 (one million repetitions of "a")
    expect(sha256Text('a'.repeat(1_000_000))).toBe('cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0');
    // Empty message: from memory, and checked against node:crypto in the next line
    expect(sha256Text('')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
    expect(sha256Text('')).toBe(nodeSha256(''));
  });

  it('agrees with node:crypto at every padding edge (0..130 bytes)', () => {
    // 55/56 and 119/120 bytes are where the length field spills into an extra block.
    for (let n = 0; n <= 130; n++) {
      const bytes = Uint8Array.from({ length: n }, (_, i) => (i * 37 + n) & 0xff);
      expect(sha256(bytes)).toBe(nodeSha256(bytes));
    }
  });

  it('agrees with node:crypto on random bytes and on Unicode text', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 600 }), (bytes) => {
        expect(sha256(bytes)).toBe(nodeSha256(bytes));
      }),
    );
    fc.assert(
      fc.property(fc.string({ unit: 'grapheme', maxLength: 80 }), (text) => {
        expect(sha256Text(text)).toBe(nodeSha256(text));
      }),
    );
  });
});

describe('canonicalJson and procedureChecksum', () => {
  it('sorts keys at every level and keeps array order', () => {
    expect(canonicalJson({ b: 1, a: [3, { d: null, c: 'x' }], e: undefined })).toBe('{"a":[3,{"c":"x","d":null}],"b":1}');
  });

  it('gives the same text for the same data in any key order', () => {
    fc.assert(
      fc.property(fc.dictionary(fc.string(), fc.jsonValue()), (obj) => {
        const reversed = Object.fromEntries(Object.entries(obj).reverse());
        expect(canonicalJson(reversed)).toBe(canonicalJson(obj));
        // Canonical text is still JSON that means the same thing.
        expect(JSON.parse(canonicalJson(obj))).toEqual(JSON.parse(JSON.stringify(obj)));
      }),
    );
  });

  it('is SHA-256 of the canonical JSON, stable across copies, and changes with the content', () => {
    const p = sumpMini();
    const sum = procedureChecksum(p);
    expect(sum).toMatch(/^[0-9a-f]{64}$/);
    expect(sum).toBe(nodeSha256(canonicalJson(p)));
    expect(procedureChecksum(structuredClone(p))).toBe(sum);
    const reordered = Object.fromEntries(Object.entries(p).reverse()) as typeof p;
    expect(procedureChecksum(reordered)).toBe(sum);
    const changed = sumpMini();
    changed.fastenerGroups[0]!.torque.value = 12;
    expect(procedureChecksum(changed)).not.toBe(sum);
  });
});
