/**
 * highlightTokens (for the editor) and the completion lists come from the
 * lexer's own token definitions.
 */
import { describe, expect, it } from 'vitest';
import { highlightTokens, KEYWORDS, STITCH_NAMES } from '../../shared/index.ts';

describe('highlightTokens', () => {
  it('classifies each kind of word', () => {
    const src = 'yarn A "Harbour" #1d3557 # main\nround 3: k2tog 2, (p1 tbl) to end in A @';
    const kinds = highlightTokens(src).map((t) => `${src.slice(t.from, t.to)}=${t.kind}`);
    expect(kinds).toEqual([
      'yarn=keyword', 'A=yarn', '"Harbour"=string', '#1d3557=colour', '# main=comment',
      'round=keyword', '3=number', ':=punctuation', 'k2tog=stitch', '2=number', ',=punctuation', '(=punctuation',
      'p1=stitch', 'tbl=stitch', ')=punctuation', 'to=keyword', 'end=keyword', 'in=keyword', 'A=yarn', '@=invalid',
    ]);
  });

  it('offers the stitch words and keywords for completion', () => {
    expect(STITCH_NAMES).toEqual(expect.arrayContaining(['k', 'p', 'k2tog', 'ssk', 'yo', 'm1l', 'm1r', 'kfb', 'sl', 'tbl', 'wyif', 'wyib', 'cdd']));
    expect(KEYWORDS).toEqual(expect.arrayContaining(['round', 'rows', 'chart', 'key', 'ladder', 'raise', 'carry', 'close', 'mark', 'every', 'times']));
    expect(KEYWORDS.filter((k) => STITCH_NAMES.includes(k))).toEqual([]);
  });
});
