import { canonicalJson, contentHash, sha256Hex } from '@rampart/collab/doc/content-hash';
import { docToPlan } from '@rampart/collab/doc/doc-to-plan';
import { planToDoc } from '@rampart/collab/doc/plan-to-doc';
import { localOrigin } from '@rampart/collab/doc/doc-origin';
import { setPartValue } from '@rampart/collab/doc/part-ops';
import * as Y from 'yjs';

import { motorDrivePlan } from './fixtures';

describe('contentHash', () => {
  test('sha256Hex("abc") → the FIPS 180-2 test vector', () => {
    // Source: NIST FIPS 180-2, appendix B.1 (one-block message "abc").
    expect(sha256Hex('abc')).toBe(
      'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad',
    );
  });

  test('sha256Hex("") → the well-known empty-message digest', () => {
    // Source: NIST SHA-256 example values for the empty message (value from memory, widely quoted).
    expect(sha256Hex('')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });

  test('sha256Hex of a two-block message → the FIPS 180-2 appendix B.2 vector', () => {
    // Source: NIST FIPS 180-2, appendix B.2 (448-bit message, two blocks after padding).
    expect(sha256Hex('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')).toBe(
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    );
  });

  test('canonicalJson → sorted keys, no spaces, undefined dropped, -0 as 0', () => {
    expect(canonicalJson({ b: 1, a: [true, null, -0], c: undefined, d: { z: 'x', y: 2.5 } })).toBe(
      '{"a":[true,null,0],"b":1,"d":{"y":2.5,"z":"x"}}',
    );
  });

  test('canonicalJson with NaN inside a part → TypeError naming the path', () => {
    expect(() => canonicalJson({ parts: [{ value: Number.NaN }] })).toThrow(
      '$.parts[0].value: NaN is not a JSON number',
    );
  });

  test('same plan read from two replicas with different key orders → same hash', () => {
    const plan = motorDrivePlan();
    const replica = new Y.Doc();
    Y.applyUpdate(replica, Y.encodeStateAsUpdate(planToDoc(plan)));
    const reordered = JSON.parse(JSON.stringify(docToPlan(replica), Object.keys(plan).reverse()));
    expect(contentHash(docToPlan(replica))).toBe(contentHash(plan));
    expect(contentHash({ ...reordered, ...plan })).toBe(contentHash(plan));
    expect(contentHash(plan)).toMatch(/^sha256:[0-9a-f]{64}$/);
  });

  test('one part value changed → different hash', () => {
    const doc = planToDoc(motorDrivePlan());
    const before = contentHash(docToPlan(doc));
    setPartValue(doc, localOrigin('u1'), 'R4', 120_000);
    expect(contentHash(docToPlan(doc))).not.toBe(before);
  });
});
