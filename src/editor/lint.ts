/**
 * Compiler diagnostics in the editor: wavy marks under each span, a gutter
 * marker on each line with a problem (worst severity wins), a hover card
 * with code, message, size, hint and quick fixes, and commands to move to
 * the next or previous problem. Spans map one-to-one (0-based UTF-16
 * offsets, `to` exclusive).
 *
 * Written on CodeMirror's view primitives rather than @codemirror/lint: the
 * compile worker already does the linting, so only the display is needed,
 * and this keeps the workspace inside its download budget.
 */
import { RangeSet, RangeSetBuilder, StateEffect, StateField, type EditorState, type Extension } from '@codemirror/state';
import { Decoration, EditorView, gutter, GutterMarker, hoverTooltip, type Command, type DecorationSet } from '@codemirror/view';
import type { Diagnostic, Severity } from '../../shared';
import { setCompiled } from './compile-state';
import type { CompiledView } from './protocol';
import { quickFixesFor, type QuickFix } from './quick-fix';

/** One diagnostic as the editor holds it (positions mapped through later edits). */
export interface LintMark {
  from: number;
  to: number;
  diagnostic: Diagnostic;
  fixes: QuickFix[];
}

const rank: Record<Severity, number> = { info: 1, warning: 2, error: 3 };
const markDeco = {
  error: Decoration.mark({ class: 'cm-lintRange cm-lintRange-error' }),
  warning: Decoration.mark({ class: 'cm-lintRange cm-lintRange-warning' }),
  info: Decoration.mark({ class: 'cm-lintRange cm-lintRange-info' }),
};

class SeverityMarker extends GutterMarker {
  constructor(readonly severity: Severity, readonly title: string) { super(); }
  override eq(other: SeverityMarker) { return other.severity === this.severity && other.title === this.title; }
  override toDOM() {
    const el = document.createElement('span');
    el.className = `lw-lint-marker lw-lint-marker-${this.severity}`;
    el.title = this.title;
    el.setAttribute('aria-hidden', 'true');
    return el;
  }
}

interface LintState { marks: LintMark[]; decorations: DecorationSet; markers: RangeSet<GutterMarker> }

/** Effect replacing every mark (from a compile answer). */
export const setLintMarks = StateEffect.define<LintMark[]>();

function derive(state: EditorState, marks: LintMark[]): LintState {
  const sorted = [...marks].sort((a, b) => a.from - b.from || a.to - b.to);
  const deco = new RangeSetBuilder<Decoration>();
  for (const m of sorted) if (m.to > m.from) deco.add(m.from, m.to, markDeco[m.diagnostic.severity]);
  const byLine = new Map<number, LintMark[]>();
  for (const m of sorted) {
    const start = state.doc.lineAt(m.from).from;
    byLine.set(start, [...(byLine.get(start) ?? []), m]);
  }
  const gut = new RangeSetBuilder<GutterMarker>();
  for (const [start, list] of [...byLine.entries()].sort((a, b) => a[0] - b[0])) {
    const worst = list.reduce((w, m) => (rank[m.diagnostic.severity] > rank[w] ? m.diagnostic.severity : w), 'info' as Severity);
    gut.add(start, start, new SeverityMarker(worst, list.map((m) => `${m.diagnostic.code}: ${m.diagnostic.message}`).join('\n')));
  }
  return { marks: sorted, decorations: deco.finish(), markers: gut.finish() };
}

/** The diagnostics shown in the editor. */
export const lintField = StateField.define<LintState>({
  create: () => ({ marks: [], decorations: Decoration.none, markers: RangeSet.empty }),
  update(value, tr) {
    for (const e of tr.effects) if (e.is(setLintMarks)) return derive(tr.state, e.value);
    if (!tr.docChanged) return value;
    const marks = value.marks.map((m) => ({ ...m, from: tr.changes.mapPos(m.from, 1), to: tr.changes.mapPos(m.to, -1) }))
      .map((m) => (m.to < m.from ? { ...m, to: m.from } : m));
    return { marks, decorations: value.decorations.map(tr.changes), markers: value.markers.map(tr.changes) };
  },
  provide: (f) => EditorView.decorations.from(f, (v) => v.decorations),
});

/** Card listing the problems at a place, with their quick fixes. */
function problemCard(view: EditorView, marks: LintMark[]): HTMLElement {
  const dom = document.createElement('div');
  dom.className = 'lw-lint-card';
  for (const m of marks) {
    const d = m.diagnostic;
    const item = document.createElement('div');
    item.className = `lw-lint-item lw-lint-item-${d.severity}`;
    const msg = document.createElement('div');
    msg.textContent = d.message;
    const meta = document.createElement('div');
    meta.className = 'lw-lint-code';
    meta.textContent = `${d.code}${d.size && !d.message.includes(`size ${d.size}`) ? ` · size ${d.size}` : ''}`;
    item.append(msg, meta);
    if (d.hint) {
      const hint = document.createElement('div');
      hint.className = 'lw-lint-hint';
      hint.textContent = d.hint;
      item.append(hint);
    }
    for (const fix of m.fixes) {
      const b = document.createElement('button');
      b.type = 'button';
      b.className = 'lw-lint-fix';
      b.textContent = `Fix: ${fix.label}`;
      b.onclick = () => {
        // The mark may have moved since the compile; apply at its mapped place.
        view.dispatch({ changes: { from: m.from, to: Math.max(m.from, m.to), insert: fix.insert }, userEvent: 'input.quickfix' });
        view.focus();
      };
      item.append(b);
    }
    dom.append(item);
  }
  return dom;
}

const lintHover = hoverTooltip((view, pos, side) => {
  const { marks } = view.state.field(lintField);
  const here = marks.filter((m) => (m.from < pos && pos < m.to) || (m.from === pos && side > 0) || (m.to === pos && side < 0) || (m.from === m.to && m.from === pos));
  if (!here.length) return null;
  return {
    pos: Math.min(...here.map((m) => m.from)),
    end: Math.max(...here.map((m) => m.to)),
    above: false,
    create: () => ({ dom: problemCard(view, here) }),
  };
});

function moveTo(view: EditorView, m: LintMark | undefined): boolean {
  if (!m) return false;
  view.dispatch({ selection: { anchor: m.from, head: m.to }, effects: EditorView.scrollIntoView(m.from, { y: 'center' }), userEvent: 'select' });
  return true;
}

/** Select the next problem after the cursor (wrapping to the first). */
export const nextProblem: Command = (view) => {
  const { marks } = view.state.field(lintField);
  const head = view.state.selection.main.head;
  return moveTo(view, marks.find((m) => m.from > head) ?? marks[0]);
};

/** Select the previous problem before the cursor (wrapping to the last). */
export const previousProblem: Command = (view) => {
  const { marks } = view.state.field(lintField);
  const at = view.state.selection.main.from;
  return moveTo(view, [...marks].reverse().find((m) => m.from < at) ?? marks[marks.length - 1]);
};

/** Marks, gutter and hover for diagnostics. */
export function loopLint(): Extension {
  return [
    lintField,
    gutter({ class: 'lw-lint-gutter', markers: (v) => v.state.field(lintField).markers, initialSpacer: () => new SeverityMarker('info', '') }),
    lintHover,
  ];
}

/** The editor mark for one compiler diagnostic, its span clipped to the text and never empty when it can be widened. */
export function toMark(d: Diagnostic, source: string, docLength: number): LintMark {
  let from = Math.min(Math.max(0, d.span.from), docLength);
  let to = Math.min(Math.max(from, d.span.to), docLength);
  if (to === from) {
    if (to < docLength && source[to] !== '\n') to += 1;
    else if (from > 0 && source[from - 1] !== '\n') from -= 1;
  }
  return { from, to, diagnostic: d, fixes: quickFixesFor(d, source) };
}

/**
 * Show a compile answer in the editor: the marks and the state field used
 * by hover. Ignored when the document has moved on since (the old marks
 * stay, mapped through the edits, until the newer answer comes).
 */
export function pushDiagnostics(view: EditorView, compiled: CompiledView): boolean {
  const doc = view.state.doc;
  if (doc.length !== compiled.source.length || doc.toString() !== compiled.source) return false;
  const marks = compiled.diagnostics.map((d) => toMark(d, compiled.source, doc.length));
  view.dispatch({ effects: [setLintMarks.of(marks), setCompiled.of(compiled)] });
  return true;
}
