/** Text as bytes for the byte group decoders (src/ingest/metar/ascii.ts). */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { asciiBytes, asciiView } from '../../../src/ingest/metar/ascii.js';

test('asciiBytes(s) copies ASCII character codes one to one', () => {
  // ANSI X3.4 (ASCII): 'K' 75, '1' 49, '/' 47, ' ' 32 (from memory)
  assert.equal(Array.from(asciiBytes('K1/ ')), [75, 49, 47, 32]);
  // constructed: expected by construction
  assert.is(asciiBytes('').length, 0);
});

test('asciiBytes(s) turns characters above 127 into 255, so no group decoder accepts them', () => {
  // constructed: 'é' (233), '°' (176) and 'Ｋ' (fullwidth, 65323) are not ASCII
  assert.equal(Array.from(asciiBytes('é°Ｋ')), [255, 255, 255]);
  // constructed: DEL (127) is still ASCII and kept
  assert.equal(Array.from(asciiBytes('\x7f')), [127]);
});

test('asciiBytes(s) returns a fresh array each call', () => {
  const a = asciiBytes('AB');
  const b = asciiBytes('AB');
  // constructed: expected by construction (one-off reads)
  assert.ok(a !== b);
  assert.equal(Array.from(a), Array.from(b));
});

test('asciiView(s, end) holds s[0, end + 2) with zeros past the text', () => {
  const v = asciiView('Q1013', 5);
  // constructed: 5 characters, then two zero bytes so a decoder may look one or two past the end
  assert.equal(Array.from(v.subarray(0, 7)), [81, 49, 48, 49, 51, 0, 0]);
});

test('asciiView(s, end) reads only up to end + 2 and never past the text', () => {
  const v = asciiView('ABCDEFG', 2);
  // constructed: indices 0–3 are written from the text, the rest of the scratch is not promised
  assert.equal(Array.from(v.subarray(0, 4)), [65, 66, 67, 68]);
  const w = asciiView('AB', 4);
  // constructed: past the text (index 2 on) the view is 0
  assert.equal(Array.from(w.subarray(0, 6)), [65, 66, 0, 0, 0, 0]);
});

test('asciiView() shares one scratch buffer and grows it for long lines', () => {
  const a = asciiView('AB', 2);
  const b = asciiView('CD', 2);
  // constructed: the same scratch (valid until the next call), so a now shows CD
  assert.ok(a === b);
  assert.equal(Array.from(a.subarray(0, 2)), [67, 68]);
  const long = 'X'.repeat(1000);
  const c = asciiView(long, 1000);
  // constructed: grown to hold 1002 bytes
  assert.ok(c.length >= 1002);
  assert.is(c[999], 88);
  assert.is(c[1001], 0);
});

test.run();
