/**
 * Compiler diagnostics as CodeMirror lint marks. Spans map one-to-one
 * (0-based UTF-16 offsets, `to` exclusive). The workspace pushes each
 * compile answer with {@link pushDiagnostics}; CodeMirror maps the marks
 * through later edits until the next answer arrives.
 */
import { setDiagnostics, type Diagnostic as CmDiagnostic } from '@codemirror/lint';
import type { EditorView } from '@codemirror/view';
import type { Diagnostic } from '../../shared';
import { setCompiled } from './compile-state';
import type { CompiledView } from './protocol';
import { quickFixesFor } from './quick-fix';

/** The lint mark for one compiler diagnostic. */
export function toLint(d: Diagnostic, source: string, docLength: number): CmDiagnostic {
  const from = Math.min(Math.max(0, d.span.from), docLength);
  const to = Math.min(Math.max(from, d.span.to), docLength);
  return {
    from,
    to,
    severity: d.severity,
    source: d.code,
    message: d.message,
    renderMessage: () => {
      const el = document.createElement('div');
      el.className = 'lw-lint-message';
      const msg = document.createElement('div');
      msg.textContent = d.message;
      el.append(msg);
      if (d.size && !d.message.includes(`size ${d.size}`)) {
        const size = document.createElement('div');
        size.className = 'lw-lint-size';
        size.textContent = `Size ${d.size}`;
        el.append(size);
      }
      if (d.hint) {
        const hint = document.createElement('div');
        hint.className = 'lw-lint-hint';
        hint.textContent = d.hint;
        el.append(hint);
      }
      return el;
    },
    actions: quickFixesFor(d, source).map((fix) => ({
      name: fix.label,
      apply: (view: EditorView) => {
        view.dispatch({ changes: { from: fix.from, to: fix.to, insert: fix.insert }, userEvent: 'input.quickfix' });
      },
    })),
  };
}

/**
 * Show a compile answer in the editor: lint marks and the state field used
 * by hover. Ignored when the document has moved on since (its marks are
 * kept, mapped through the edits, until the newer answer comes).
 */
export function pushDiagnostics(view: EditorView, compiled: CompiledView): boolean {
  const doc = view.state.doc;
  if (doc.length !== compiled.source.length || doc.toString() !== compiled.source) return false;
  const marks = compiled.diagnostics.map((d) => toLint(d, compiled.source, doc.length));
  const spec = setDiagnostics(view.state, marks);
  view.dispatch({ ...spec, effects: [...toArray(spec.effects), setCompiled.of(compiled)] });
  return true;
}

function toArray<T>(x: T | readonly T[] | undefined): T[] {
  if (x === undefined) return [];
  return Array.isArray(x) ? [...(x as readonly T[])] : [x as T];
}
