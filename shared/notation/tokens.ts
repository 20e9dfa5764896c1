/**
 * Tokens of the Loopwright notation (stage 1 of 3: tokens -> parser -> AST).
 *
 * `allTokens` is ordered: keywords before stitch words before plain names,
 * each keyword with `longer_alt: Name` so "marker" is a keyword but
 * "markers2" is a name. Keywords and stitch words are case-insensitive;
 * names (yarns, segments, charts, sizes) keep their case.
 */
import { createToken, Lexer, type TokenType } from 'chevrotain';
import { STITCH_WORDS, MODIFIER_WORDS } from './stitches';

/** Plain names: yarn short names, sizes, segments, markers, charts. */
// Latin letters with accents (U+00C0-U+024F, except × and ÷) are letters too: "Säule", "Brú".
export const Name = createToken({ name: 'Name', pattern: /[A-Za-z_\u00C0-\u00D6\u00D8-\u00F6\u00F8-\u024F][A-Za-z0-9_\u00C0-\u00D6\u00D8-\u00F6\u00F8-\u024F-]*/, label: 'a name' });

const keywordTokens: TokenType[] = [];
function keyword(word: string): TokenType {
  const t = createToken({
    name: word[0].toUpperCase() + word.slice(1),
    pattern: new RegExp(word, 'i'),
    longer_alt: Name,
    label: `'${word}'`,
  });
  keywordTokens.push(t);
  return t;
}

// Longer words first where one is a prefix of another (rounds/round, marker/mark).
export const Title = keyword('title');
export const Designer = keyword('designer');
export const Item = keyword('item');
export const Sizes = keyword('sizes');
export const Gauge = keyword('gauge');
export const Stitches = keyword('stitches');
export const Sts = keyword('sts');
export const And = keyword('and');
export const Rounds = keyword('rounds');
export const Round = keyword('round');
export const Rows = keyword('rows');
export const Row = keyword('row');
export const Per = keyword('per');
export const Over = keyword('over');
export const Cm = keyword('cm');
export const Yarn = keyword('yarn');
export const Work = keyword('work');
export const Flat = keyword('flat');
export const The = keyword('the');
export const Float = keyword('float');
export const Limit = keyword('limit');
export const Cast = keyword('cast');
export const Once = keyword('once');
export const On = keyword('on');
export const Every = keyword('every');
export const Other = keyword('other');
export const At = keyword('at');
export const Note = keyword('note');
export const Chart = keyword('chart');
export const Key = keyword('key');
export const None = keyword('none');
export const To = keyword('to');
export const End = keyword('end');
export const Last = keyword('last');
export const Marker = keyword('marker');
export const Mark = keyword('mark');
export const Unmark = keyword('unmark');
/** Trade words for markers: pm (place), sm (slip), rm (remove). */
export const Pm = keyword('pm');
export const Sm = keyword('sm');
export const Rm = keyword('rm');
export const Times = keyword('times');
export const Catch = keyword('catch');
export const Raise = keyword('raise');
export const Carry = keyword('carry');
export const Close = keyword('close');
export const Cable = keyword('cable');
export const Left = keyword('left');
export const Right = keyword('right');
export const Ladder = keyword('ladder');
export const Columns = keyword('columns');
export const From = keyword('from');
export const In = keyword('in');

/** A stitch word, optionally with a count suffix: k, k5, k2tog, sl1, m1l. */
export const Stitch = createToken({
  name: 'Stitch',
  pattern: new RegExp(`(?:${STITCH_WORDS.join('|')})\\d*`, 'i'),
  longer_alt: Name,
  label: 'a stitch',
});
/** tbl, wyif, wyib after a stitch. */
export const Modifier = createToken({
  name: 'Modifier',
  pattern: new RegExp(MODIFIER_WORDS.join('|'), 'i'),
  longer_alt: Name,
  label: 'tbl, wyif or wyib',
});

export const WhiteSpace = createToken({ name: 'WhiteSpace', pattern: /[ \t\r\n\f\v\u00a0\ufeff]+/, group: Lexer.SKIPPED });
/** #1d3557: a colour (six hex digits, nothing after). */
export const Colour = createToken({
  name: 'Colour',
  pattern: /#[0-9a-fA-F]{6}(?![0-9A-Za-z_])/,
  start_chars_hint: ['#'],
  label: 'a colour such as #1d3557',
});
/** # to the end of the line. */
export const Comment = createToken({ name: 'Comment', pattern: /#[^\n\r]*/, group: 'comments' });
/** |..xx..| one chart row, a character per stitch. */
export const GridRow = createToken({ name: 'GridRow', pattern: /\|[^|\n\r]*\|/, label: 'a chart row between | bars' });
export const Text = createToken({ name: 'Text', pattern: /"[^"\n\r]*"/, label: 'quoted text' });
export const Ordinal = createToken({ name: 'Ordinal', pattern: /\d+(?:st|nd|rd|th)/i, longer_alt: Name, label: 'an ordinal such as 3rd' });
export const NumberLit = createToken({ name: 'NumberLit', pattern: /\d+(?:\.\d+)?/, label: 'a number' });
export const Colon = createToken({ name: 'Colon', pattern: /:/, label: "':'" });
export const Comma = createToken({ name: 'Comma', pattern: /,/, label: "','" });
export const LParen = createToken({ name: 'LParen', pattern: /\(/, label: "'('" });
export const RParen = createToken({ name: 'RParen', pattern: /\)/, label: "')'" });
export const Slash = createToken({ name: 'Slash', pattern: /\//, label: "'/'" });
export const Dash = createToken({ name: 'Dash', pattern: /[-\u2013]/, label: "'-'" });

/** Every token, in matching order. */
export const allTokens: TokenType[] = [
  WhiteSpace, Colour, Comment, GridRow, Text, Ordinal, NumberLit,
  Colon, Comma, LParen, RParen, Slash, Dash,
  ...keywordTokens, Modifier, Stitch, Name,
];

/** The keyword words, for editor completion. */
export const KEYWORD_WORDS: readonly string[] = keywordTokens.map((t) => String(t.LABEL).slice(1, -1));

/** The lexer, created once (positions tracked in full for spans). */
export const lexer = new Lexer(allTokens, { positionTracking: 'full', ensureOptimizations: false });

/** True for keyword token types. */
export function isKeywordToken(t: TokenType): boolean {
  return keywordTokens.includes(t);
}
