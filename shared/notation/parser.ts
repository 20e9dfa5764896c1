/**
 * The grammar of the Loopwright notation (stage 2 of 3): a grammar-only
 * chevrotain CstParser, created once and reused. Error recovery is on, so a
 * typo in one statement does not hide problems in the next; the CST-to-AST
 * stage (to-ast.ts) is defensive about recovered nodes.
 *
 * A source is a list of statements, each introduced by a keyword:
 * header lines (title, designer, sizes, gauge, yarn, work, float limit),
 * `cast on`, `round`/`rows` lines with operation lists, `chart` blocks and
 * `ladder` lines. Newlines carry no meaning; commas separate operations.
 */
import { CstParser, EOF, type CstNode, type IOrAlt, type IToken, type TokenType } from 'chevrotain';
import * as T from './tokens';

function describe(t: TokenType): string {
  return t === EOF ? 'the end of the text' : String(t.LABEL ?? t.name);
}
function describeToken(t: IToken): string {
  return t.tokenType === EOF ? 'the end of the text' : `'${t.image}'`;
}
function listPaths(paths: TokenType[][]): string {
  const firsts = [...new Set(paths.map((p) => (p[0] ? describe(p[0]) : '')).filter(Boolean))];
  if (firsts.length > 6) return `${firsts.slice(0, 6).join(', ')} or another ${firsts.length - 6}`;
  return firsts.join(', ');
}

/** Parse error messages in plain words: what was expected, what was found. */
const errorMessageProvider = {
  buildMismatchTokenMessage({ expected, actual }: { expected: TokenType; actual: IToken }): string {
    return `expected ${describe(expected)} but found ${describeToken(actual)}`;
  },
  buildNotAllInputParsedMessage({ firstRedundant }: { firstRedundant: IToken }): string {
    return `did not expect ${describeToken(firstRedundant)} here`;
  },
  buildNoViableAltMessage({ expectedPathsPerAlt, actual, ruleName }: { expectedPathsPerAlt: TokenType[][][]; actual: IToken[]; ruleName: string }): string {
    const what = ruleName === 'statement' ? 'a statement (title, sizes, yarn, cast on, round, chart, ladder, ...)' : ruleName === 'op' ? 'a stitch or operation' : listPaths(expectedPathsPerAlt.flat());
    return `expected ${what} but found ${describeToken(actual[0])}`;
  },
  buildEarlyExitMessage({ expectedIterationPaths, actual }: { expectedIterationPaths: TokenType[][]; actual: IToken[] }): string {
    return `expected ${listPaths(expectedIterationPaths)} but found ${describeToken(actual[0])}`;
  },
};

/** Grammar-only parser. Use {@link parseTokens}; do not construct more. */
class LoopParser extends CstParser {
  constructor() {
    super(T.allTokens, { recoveryEnabled: true, errorMessageProvider, maxLookahead: 3, nodeLocationTracking: 'full' });
    this.performSelfAnalysis();
  }

  // Alternatives of each OR, built once: creating them on every call is the
  // main cost of parsing (chevrotain's own performance advice).
  private altCache: IOrAlt<unknown>[][] = [];
  private alts(id: number, make: () => IOrAlt<unknown>[]): IOrAlt<unknown>[] {
    return (this.altCache[id] ??= make());
  }

  public pattern = this.RULE('pattern', () => {
    this.MANY(() => this.SUBRULE(this.statement));
  });

  public statement = this.RULE('statement', () => {
    this.OR(this.alts(1, () => [
      { ALT: () => this.SUBRULE(this.titleLine) },
      { ALT: () => this.SUBRULE(this.designerLine) },
      { ALT: () => this.SUBRULE(this.itemLine) },
      { ALT: () => this.SUBRULE(this.sizesLine) },
      { ALT: () => this.SUBRULE(this.gaugeLine) },
      { ALT: () => this.SUBRULE(this.yarnLine) },
      { ALT: () => this.SUBRULE(this.workLine) },
      { ALT: () => this.SUBRULE(this.floatLine) },
      { ALT: () => this.SUBRULE(this.castOnLine) },
      { ALT: () => this.SUBRULE(this.roundLine) },
      { ALT: () => this.SUBRULE(this.chartBlock) },
      { ALT: () => this.SUBRULE(this.ladderLine) },
    ]));
  });

  public titleLine = this.RULE('titleLine', () => {
    this.CONSUME(T.Title);
    this.CONSUME(T.Text);
  });

  public designerLine = this.RULE('designerLine', () => {
    this.CONSUME(T.Designer);
    this.CONSUME(T.Text);
  });

  /** `item mitts`: what the pattern makes, for finished-size comparisons. */
  public itemLine = this.RULE('itemLine', () => {
    this.CONSUME(T.Item);
    this.CONSUME(T.Name, { LABEL: 'item' });
  });

  public sizesLine = this.RULE('sizesLine', () => {
    this.CONSUME(T.Sizes);
    this.AT_LEAST_ONE(() => {
      this.OR(this.alts(2, () => [
        { ALT: () => this.CONSUME(T.Name, { LABEL: 'size' }) },
        { ALT: () => this.CONSUME(T.NumberLit, { LABEL: 'size' }) },
        { ALT: () => this.CONSUME(T.Text, { LABEL: 'size' }) },
      ]));
    });
  });

  public gaugeLine = this.RULE('gaugeLine', () => {
    this.CONSUME(T.Gauge);
    this.CONSUME(T.NumberLit, { LABEL: 'stitches' });
    this.OR(this.alts(3, () => [{ ALT: () => this.CONSUME(T.Sts) }, { ALT: () => this.CONSUME(T.Stitches) }]));
    this.OPTION(() => this.CONSUME(T.And));
    this.CONSUME2(T.NumberLit, { LABEL: 'rows' });
    this.OR2(this.alts(4, () => [{ ALT: () => this.CONSUME(T.Rounds) }, { ALT: () => this.CONSUME(T.Rows) }]));
    this.OR3(this.alts(5, () => [{ ALT: () => this.CONSUME(T.Per) }, { ALT: () => this.CONSUME(T.Over) }]));
    this.CONSUME3(T.NumberLit, { LABEL: 'length' });
    this.SUBRULE(this.unit);
  });

  public unit = this.RULE('unit', () => {
    this.OR(this.alts(6, () => [{ ALT: () => this.CONSUME(T.Cm) }, { ALT: () => this.CONSUME(T.In) }]));
  });

  public yarnLine = this.RULE('yarnLine', () => {
    this.CONSUME(T.Yarn);
    this.CONSUME(T.Name);
    this.CONSUME(T.Text);
    this.CONSUME(T.Colour);
  });

  public workLine = this.RULE('workLine', () => {
    this.CONSUME(T.Work);
    this.OR(this.alts(7, () => [
      { ALT: () => this.CONSUME(T.Flat) },
      {
        ALT: () => {
          this.CONSUME(T.In);
          this.CONSUME(T.The);
          this.CONSUME(T.Round);
        },
      },
    ]));
  });

  public floatLine = this.RULE('floatLine', () => {
    this.CONSUME(T.Float);
    this.CONSUME(T.Limit);
    this.CONSUME(T.NumberLit);
    this.SUBRULE(this.unit);
  });

  public castOnLine = this.RULE('castOnLine', () => {
    this.CONSUME(T.Cast);
    this.CONSUME(T.On);
    this.SUBRULE(this.graded);
    this.OPTION(() => this.SUBRULE(this.inYarn));
  });

  public roundLine = this.RULE('roundLine', () => {
    this.OR(this.alts(8, () => [
      { ALT: () => this.CONSUME(T.Round, { LABEL: 'word' }) },
      { ALT: () => this.CONSUME(T.Rounds, { LABEL: 'word' }) },
      { ALT: () => this.CONSUME(T.Row, { LABEL: 'word' }) },
      { ALT: () => this.CONSUME(T.Rows, { LABEL: 'word' }) },
    ]));
    this.SUBRULE(this.graded, { LABEL: 'first' });
    this.OPTION(() => {
      this.CONSUME(T.Dash);
      this.SUBRULE2(this.graded, { LABEL: 'last' });
    });
    this.OPTION2(() => {
      this.CONSUME(T.Every);
      this.OR2(this.alts(9, () => [{ ALT: () => this.CONSUME(T.Ordinal) }, { ALT: () => this.CONSUME(T.Other) }]));
    });
    this.OPTION3(() => {
      this.CONSUME(T.At);
      this.CONSUME(T.Name, { LABEL: 'segment' });
    });
    this.OPTION4(() => this.SUBRULE(this.inYarn));
    this.CONSUME(T.Colon);
    this.SUBRULE(this.opList);
    this.OPTION5(() => {
      this.CONSUME(T.Note);
      this.CONSUME(T.Text);
    });
  });

  public opList = this.RULE('opList', () => {
    this.AT_LEAST_ONE_SEP({ SEP: T.Comma, DEF: () => this.SUBRULE(this.op) });
  });

  public op = this.RULE('op', () => {
    this.OR(this.alts(10, () => [
      { ALT: () => this.SUBRULE(this.stitchOp) },
      { ALT: () => this.SUBRULE(this.group) },
      { ALT: () => this.SUBRULE(this.chartOp) },
      { ALT: () => this.SUBRULE(this.markOp) },
      { ALT: () => this.SUBRULE(this.unmarkOp) },
      { ALT: () => this.SUBRULE(this.slipMarkerOp) },
      { ALT: () => this.SUBRULE(this.catchOp) },
      { ALT: () => this.SUBRULE(this.raiseOp) },
      { ALT: () => this.SUBRULE(this.carryOp) },
      { ALT: () => this.SUBRULE(this.closeOp) },
      { ALT: () => this.SUBRULE(this.cableOp) },
    ]));
  });

  public stitchOp = this.RULE('stitchOp', () => {
    this.CONSUME(T.Stitch);
    this.OPTION(() => this.CONSUME(T.Modifier));
    this.OPTION2(() => this.SUBRULE(this.amount));
    this.OPTION3(() => this.CONSUME2(T.Modifier));
    this.OPTION4(() => this.SUBRULE(this.inYarn));
  });

  public amount = this.RULE('amount', () => {
    this.OR(this.alts(11, () => [{ ALT: () => this.SUBRULE(this.graded) }, { ALT: () => this.SUBRULE(this.toSpec) }]));
  });

  public toSpec = this.RULE('toSpec', () => {
    this.CONSUME(T.To);
    this.OR(this.alts(12, () => [
      { ALT: () => this.CONSUME(T.End) },
      {
        ALT: () => {
          this.CONSUME(T.Last);
          this.SUBRULE(this.graded);
        },
      },
      {
        ALT: () => {
          this.CONSUME(T.Marker);
          this.OPTION(() => this.CONSUME(T.Name));
        },
      },
    ]));
  });

  public group = this.RULE('group', () => {
    this.CONSUME(T.LParen);
    this.SUBRULE(this.opList);
    this.CONSUME(T.RParen);
    this.OPTION(() => {
      this.OR(this.alts(13, () => [
        {
          ALT: () => {
            this.SUBRULE(this.graded);
            this.CONSUME(T.Times);
          },
        },
        { ALT: () => this.SUBRULE(this.toSpec) },
        { ALT: () => this.CONSUME(T.Once) },
      ]));
    });
    this.OPTION2(() => this.SUBRULE(this.inYarn));
  });

  public chartOp = this.RULE('chartOp', () => {
    this.CONSUME(T.Chart);
    this.CONSUME(T.Name);
    this.OPTION(() => {
      this.CONSUME(T.Row);
      this.SUBRULE(this.graded);
    });
    this.OPTION2(() => this.CONSUME(T.Once));
  });

  public markOp = this.RULE('markOp', () => {
    this.OR(this.alts(14, () => [{ ALT: () => this.CONSUME(T.Mark) }, { ALT: () => this.CONSUME(T.Pm) }]));
    this.CONSUME(T.Name);
  });

  public unmarkOp = this.RULE('unmarkOp', () => {
    this.OR(this.alts(15, () => [{ ALT: () => this.CONSUME(T.Unmark) }, { ALT: () => this.CONSUME(T.Rm) }]));
    this.CONSUME(T.Name);
  });

  public slipMarkerOp = this.RULE('slipMarkerOp', () => {
    this.CONSUME(T.Sm);
    this.OPTION(() => this.CONSUME(T.Name));
  });

  public catchOp = this.RULE('catchOp', () => {
    this.CONSUME(T.Catch);
    this.CONSUME(T.Name);
  });

  public raiseOp = this.RULE('raiseOp', () => {
    this.CONSUME(T.Raise);
    this.CONSUME(T.Name);
  });

  public carryOp = this.RULE('carryOp', () => {
    this.CONSUME(T.Carry);
    this.OPTION(() => this.SUBRULE(this.graded));
  });

  public closeOp = this.RULE('closeOp', () => {
    this.CONSUME(T.Close);
    this.OPTION(() => this.CONSUME(T.Stitch));
  });

  public cableOp = this.RULE('cableOp', () => {
    this.CONSUME(T.Cable);
    this.CONSUME(T.NumberLit, { LABEL: 'held' });
    this.CONSUME(T.Over);
    this.CONSUME2(T.NumberLit, { LABEL: 'worked' });
    this.OR(this.alts(16, () => [{ ALT: () => this.CONSUME(T.Left) }, { ALT: () => this.CONSUME(T.Right) }]));
    this.OPTION(() => this.SUBRULE(this.inYarn));
  });

  public inYarn = this.RULE('inYarn', () => {
    this.CONSUME(T.In);
    this.CONSUME(T.Name);
  });

  public chartBlock = this.RULE('chartBlock', () => {
    this.CONSUME(T.Chart);
    this.CONSUME(T.Name);
    this.CONSUME(T.Colon);
    this.MANY(() => this.SUBRULE(this.keyLine));
    this.AT_LEAST_ONE(() => this.CONSUME(T.GridRow));
  });

  public keyLine = this.RULE('keyLine', () => {
    this.CONSUME(T.Key);
    this.CONSUME(T.Text);
    this.OR(this.alts(17, () => [
      { ALT: () => this.CONSUME(T.None) },
      {
        ALT: () => {
          this.CONSUME(T.Name);
          this.OPTION(() => this.CONSUME(T.Stitch));
          this.OPTION2(() => this.CONSUME(T.Modifier));
        },
      },
      {
        ALT: () => {
          this.CONSUME2(T.Stitch);
          this.OPTION3(() => this.CONSUME2(T.Modifier));
        },
      },
    ]));
  });

  public ladderLine = this.RULE('ladderLine', () => {
    this.CONSUME(T.Ladder);
    this.CONSUME(T.Name, { LABEL: 'yarn' });
    this.OR(this.alts(18, () => [
      {
        ALT: () => {
          this.CONSUME(T.Every);
          this.SUBRULE(this.graded, { LABEL: 'every' });
        },
      },
      {
        ALT: () => {
          this.CONSUME(T.Columns);
          this.AT_LEAST_ONE_SEP({ SEP: T.Comma, DEF: () => this.SUBRULE2(this.graded, { LABEL: 'column' }) });
        },
      },
    ]));
    this.CONSUME(T.From);
    this.OR2(this.alts(19, () => [{ ALT: () => this.CONSUME(T.Round) }, { ALT: () => this.CONSUME(T.Row) }]));
    this.SUBRULE3(this.graded, { LABEL: 'first' });
    this.CONSUME(T.To);
    this.SUBRULE4(this.graded, { LABEL: 'last' });
    this.OPTION(() => {
      this.CONSUME(T.At);
      this.CONSUME2(T.Name, { LABEL: 'segment' });
    });
    this.OPTION2(() => {
      this.CONSUME(T.Close);
      this.CONSUME(T.Stitch);
    });
  });

  public graded = this.RULE('graded', () => {
    this.CONSUME(T.NumberLit);
    this.MANY(() => {
      this.CONSUME(T.Slash);
      this.CONSUME2(T.NumberLit);
    });
  });
}

let instance: LoopParser | null = null;
/** The single parser instance (created on first use; creation analyses the grammar). */
export function getParser(): LoopParser {
  instance ??= new LoopParser();
  return instance;
}

/** Token types that can start a statement. */
const starters = new Set<TokenType>([T.Title, T.Designer, T.Item, T.Sizes, T.Gauge, T.Yarn, T.Work, T.Float, T.Cast, T.Ladder]);

/**
 * True when token i starts a statement. `round`/`row` words start one only
 * when a number follows and they are not part of "chart NAME row 2";
 * `chart` starts a block only as "chart NAME:".
 */
export function startsStatement(tokens: IToken[], i: number): boolean {
  const t = tokens[i].tokenType;
  if (starters.has(t)) return true;
  if (t === T.Round || t === T.Rounds || t === T.Row || t === T.Rows) {
    // "round 5:", "rows 2-10 every 3rd at back in B:" start a line; "chart wave row 3," does not.
    let j = i + 1;
    if (tokens[j]?.tokenType !== T.NumberLit) return false;
    while (tokens[j + 1]?.tokenType === T.Slash && tokens[j + 2]?.tokenType === T.NumberLit) j += 2;
    const after = tokens[j + 1]?.tokenType;
    if (after === T.Colon || after === T.Dash || after === T.Every || after === T.At || after === T.In) return true;
    // "round 3 k to end" (colon forgotten) still starts a line when it is the first word on its line.
    return i > 0 && (tokens[i - 1].endLine ?? 0) < (tokens[i].startLine ?? 0);
  }
  if (t === T.Chart) return tokens[i + 1]?.tokenType === T.Name && tokens[i + 2]?.tokenType === T.Colon;
  return false;
}

/** One parsed statement: its CST (possibly partial after recovery) and its tokens. */
export interface ParsedStatement { cst: CstNode; tokens: IToken[] }
/** A parse error with the token where it was noticed. */
export interface ParseError { message: string; token: IToken; previous?: IToken }

/**
 * Parses lexed tokens statement by statement: the token stream is cut before
 * every token that can start a statement and each piece is parsed on its own,
 * so an error never swallows the following lines. Stops after `maxErrors`
 * errors (`stopped` is then true). Never throws.
 */
export function parseTokens(tokens: IToken[], maxErrors = Infinity): { statements: ParsedStatement[]; errors: ParseError[]; stopped: boolean } {
  const parser = getParser();
  const statements: ParsedStatement[] = [];
  const errors: ParseError[] = [];
  let start = 0;
  for (let i = 1; i <= tokens.length; i++) {
    if (i < tokens.length && !startsStatement(tokens, i)) continue;
    const piece = tokens.slice(start, i);
    start = i;
    parser.input = piece;
    const cst = parser.statement();
    for (const e of parser.errors) {
      errors.push({ message: e.message, token: e.token, previous: (e as { previousToken?: IToken }).previousToken });
    }
    if (cst) statements.push({ cst, tokens: piece });
    // Garbage input: past the cap, stop reading rather than grind through it.
    if (errors.length > maxErrors) return { statements, errors, stopped: i < tokens.length };
  }
  return { statements, errors, stopped: false };
}

export type { LoopParser };
