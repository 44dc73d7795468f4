import { describe, expect, it } from 'vitest';
import { LineIndex } from '../../src/core/diagnostics/line-index.ts';

// Line endings as CommonMark defines them (common practice for editors too): \r\n, \n, or a lone \r.
describe('LineIndex: offsets to 1-based line:column', () => {
  it('counts \\n, \\r\\n and a lone \\r as one line end each', () => {
    const index = new LineIndex('ab\ncd\r\nef\rgh');
    expect(index.point(0)).toEqual({ line: 1, column: 1, offset: 0 });
    expect(index.point(3)).toEqual({ line: 2, column: 1, offset: 3 });
    expect(index.point(7)).toEqual({ line: 3, column: 1, offset: 7 });
    expect(index.point(10)).toEqual({ line: 4, column: 1, offset: 10 });
    expect(index.point(11)).toEqual({ line: 4, column: 2, offset: 11 });
  });
  it('clamps offsets into the text and omits the end of an empty span', () => {
    const index = new LineIndex('x\ny');
    expect(index.point(99)).toEqual({ line: 2, column: 2, offset: 3 });
    expect(index.location('f.md', 2, 2)).toEqual({ file: 'f.md', start: { line: 2, column: 1, offset: 2 } });
    expect(index.location('f.md', 0, 3).end).toEqual({ line: 2, column: 2, offset: 3 });
  });
});
