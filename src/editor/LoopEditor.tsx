/**
 * The Loopwright source editor (CodeMirror 6) as a React component.
 *
 * The editor owns its document; React hears about changes through
 * `onDocChange` and about the cursor's line through `onCursorLine`, and
 * drives the editor through the {@link EditorHandle} it receives. The view
 * is created once per `docKey` (a pattern), so re-renders never reset it.
 */
import { useEffect, useRef } from 'react';
import { Compartment, EditorState, type Extension } from '@codemirror/state';
import { EditorView, highlightActiveLine, highlightActiveLineGutter, keymap, lineNumbers } from '@codemirror/view';
import {
  copyLineDown, copyLineUp, deleteLine, history, historyKeymap, insertNewline, moveLineDown, moveLineUp, selectLine,
} from '@codemirror/commands';
import { completionKeymap } from '@codemirror/autocomplete';
import '../styles/editor.css';
import { compiledField } from './compile-state';
import { loopCompletion } from './completion';
import { loopHighlighting } from './highlight';
import { loopLint, nextProblem, previousProblem } from './lint';
import { roundHover } from './hover';

/** What the workspace can do to the editor. */
export interface EditorHandle {
  view: EditorView;
  /** Select `from`–`to` (offsets), scroll it into view and focus the editor. */
  jumpTo: (from: number, to?: number) => void;
  /** Replace the whole text as one undoable change. */
  replaceDoc: (text: string) => void;
  focus: () => void;
}

export interface LoopEditorProps {
  /** Identity of the document; a new key builds a fresh editor. */
  docKey: string;
  initialDoc: string;
  onDocChange: (doc: string) => void;
  /** 1-based line of the main cursor. */
  onCursorLine?: (line: number) => void;
  onReady: (handle: EditorHandle | null) => void;
  /** Extra keyboard shortcuts (for example pane switching). */
  extraKeys?: Extension;
  /** Read-only for people who may not save (set when the editor is built). */
  readOnly?: boolean;
}

/**
 * The language and editing extensions of a Loopwright editor, without React
 * glue. Deliberately lean (native selection drawing, no bracket closing):
 * every kilobyte here is downloaded before a pattern opens.
 */
export function loopExtensions(): Extension[] {
  return [
    lineNumbers(),
    loopLint(),
    highlightActiveLineGutter(),
    history(),
    highlightActiveLine(),
    // Long rounds wrap rather than scroll sideways in a half-width editor.
    EditorView.lineWrapping,
    EditorState.tabSize.of(2),
    compiledField,
    loopHighlighting,
    loopCompletion,
    roundHover,
  ];
}

/**
 * Find and replace loads on first use (Mod-F): it is not needed to open a
 * pattern, and leaving it out keeps the workspace's first download smaller.
 */
const searchSlot = new Compartment();
async function openSearch(view: EditorView): Promise<void> {
  const m = await import('@codemirror/search');
  const current = searchSlot.get(view.state);
  if (Array.isArray(current) && current.length === 0) {
    view.dispatch({ effects: searchSlot.reconfigure([m.search({ top: true }), keymap.of(m.searchKeymap), m.highlightSelectionMatches()]) });
  }
  m.openSearchPanel(view);
}

/**
 * Keys beyond what the browser's own editing already does in the editor
 * (moving, selecting and deleting by character, word and line are left to
 * the browser, which CodeMirror follows): a plain new line on Enter (a
 * pattern source has no automatic indentation) and line commands. Leaving
 * out CodeMirror's standard keymap and its indentation machinery keeps the
 * workspace inside its download budget.
 */
const lineKeys = [
  { key: 'Enter', run: insertNewline },
  { key: 'Alt-ArrowUp', run: moveLineUp },
  { key: 'Alt-ArrowDown', run: moveLineDown },
  { key: 'Shift-Alt-ArrowUp', run: copyLineUp },
  { key: 'Shift-Alt-ArrowDown', run: copyLineDown },
  { key: 'Shift-Mod-k', run: deleteLine },
  { key: 'Mod-l', run: selectLine, preventDefault: true },
];

export function LoopEditor({ docKey, initialDoc, onDocChange, onCursorLine, onReady, extraKeys, readOnly = false }: LoopEditorProps) {
  const host = useRef<HTMLDivElement>(null);
  // Latest callbacks, read by the long-lived editor without rebuilding it.
  const callbacks = useRef({ onDocChange, onCursorLine, onReady });
  callbacks.current = { onDocChange, onCursorLine, onReady };

  useEffect(() => {
    if (!host.current) return;
    let lastLine = -1;
    const view = new EditorView({
      parent: host.current,
      state: EditorState.create({
        doc: initialDoc,
        extensions: [
          keymap.of([
            { key: 'F8', run: nextProblem, preventDefault: true },
            { key: 'Shift-F8', run: previousProblem, preventDefault: true },
            { key: 'Mod-f', preventDefault: true, run: (v) => { void openSearch(v); return true; } },
          ]),
          extraKeys ?? [],
          EditorState.readOnly.of(readOnly),
          searchSlot.of([]),
          keymap.of([...completionKeymap, ...lineKeys, ...historyKeymap]),
          loopExtensions(),
          EditorView.contentAttributes.of({ 'aria-label': 'Pattern source', spellcheck: 'false', autocapitalize: 'off', autocorrect: 'off' }),
          EditorView.updateListener.of((u) => {
            if (u.docChanged) callbacks.current.onDocChange(u.state.doc.toString());
            if (u.docChanged || u.selectionSet) {
              const line = u.state.doc.lineAt(u.state.selection.main.head).number;
              if (line !== lastLine) {
                lastLine = line;
                callbacks.current.onCursorLine?.(line);
              }
            }
          }),
        ],
      }),
    });
    const handle: EditorHandle = {
      view,
      jumpTo: (from, to = from) => {
        const len = view.state.doc.length;
        const a = Math.min(Math.max(0, from), len);
        const b = Math.min(Math.max(a, to), len);
        view.dispatch({ selection: { anchor: a, head: b }, effects: EditorView.scrollIntoView(a, { y: 'center' }) });
        view.focus();
      },
      replaceDoc: (text) => {
        view.dispatch({ changes: { from: 0, to: view.state.doc.length, insert: text }, userEvent: 'input.replace' });
      },
      focus: () => view.focus(),
    };
    callbacks.current.onReady(handle);
    callbacks.current.onCursorLine?.(1);
    return () => {
      callbacks.current.onReady(null);
      view.destroy();
    };
    // The editor is rebuilt only for a new document; initialDoc is read once.
  }, [docKey]);

  return <div ref={host} className="lw-editor h-full min-h-0 overflow-hidden" data-testid="editor" />;
}
