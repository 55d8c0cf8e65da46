// A boundary file nested thousands of collections deep is refused with a sentence where it is parsed, instead of
// exhausting the parser's stack.
import { DOMParser } from '@xmldom/xmldom';
import { describe, expect, it } from 'vitest';
import { BoundaryError } from '../../shared/boundary/boundary-faults.ts';
import { parseBoundaryText } from '../../shared/boundary/parse-boundary.ts';

const nested = (depth: number) => '{"type":"GeometryCollection","geometries":['.repeat(depth) + ']}'.repeat(depth);

describe('nesting in a boundary file', () => {
  it('refuses GeometryCollections nested 50,000 deep with the sentence that says what to send', () => {
    let error: unknown;
    try {
      parseBoundaryText(nested(50_000), DOMParser as never);
    } catch (thrown) {
      error = thrown;
    }
    expect(error).toBeInstanceOf(BoundaryError);
    expect((error as BoundaryError).fault.code).toBe('unparseable');
    expect((error as BoundaryError).message).toMatch(/nests collections more than 16 levels deep/);
  });
});
