/**
 * The studio: the source editor on the left, views of the compiled pattern
 * on the right (counts and problems; more as renderers arrive), saving with
 * a message, drafts kept locally, and stale-save conflicts resolved without
 * losing either side.
 */
import { lazy, Suspense, useCallback, useEffect, useMemo, useRef, useState } from 'react';
import type { Span } from '../../../shared';
import type { Pattern, Revision } from '../../api/types';
import { LoopEditor, type EditorHandle } from '../../editor/LoopEditor';
import { pushDiagnostics } from '../../editor/lint';
import { pushTokens } from '../../editor/highlight';
import { setVocabulary } from '../../editor/completion';
import { roundsOnLine } from '../../editor/rounds';
import { useCompiler } from '../../editor/useCompiler';
import type { QuickFix } from '../../editor/quick-fix';
import type { PlanAnswer } from '../../editor/protocol';
import { Notice } from '../Notice';
import { relativeTime } from '../format';
import { ChartPane, type ChartSettings } from './ChartPane';
import { CountsPane } from './CountsPane';
import { HelpOverlay } from './HelpOverlay';
import { InstructionsPane } from './InstructionsPane';
import { PaneTabs, type PaneTab } from './PaneTabs';
import { ProblemsPane } from './ProblemsPane';
import { SaveDialog } from './SaveDialog';
import { useEditingSession } from './useEditingSession';
import { useSaveFlow } from './useSaveFlow';
import { useWorkspaceKeys } from './useWorkspaceKeys';
import { WorkspaceHeader } from './WorkspaceHeader';

type PaneKey = 'counts' | 'problems' | 'chart' | 'instructions' | 'summary';

// The summary pane (and its worker) load the first time it opens.
const SummaryPane = lazy(() => import('./SummaryPane').then((m) => ({ default: m.SummaryPane })));
// Loaded only when a save meets a newer revision (it brings the text-diff library).
const ConflictDialog = lazy(() => import('./ConflictDialog').then((m) => ({ default: m.ConflictDialog })));

export interface WorkspaceViewProps {
  patternId: string;
  pattern: Pattern;
  latest: Revision | null;
}

export function WorkspaceView({ patternId, pattern, latest }: WorkspaceViewProps) {
  const session = useEditingSession(patternId, latest);
  const compiler = useCompiler({
    onTokens: (m) => { if (editor.current) pushTokens(editor.current.view, m); },
    onVocabulary: (m) => setVocabulary(m.stitches, m.keywords),
  });
  const editor = useRef<EditorHandle | null>(null);
  const [pane, setPane] = useState<PaneKey>('counts');
  const [cursorLine, setCursorLine] = useState(1);
  const [helpOpen, setHelpOpen] = useState(false);
  const [showRestored, setShowRestored] = useState(session.restored !== null);
  const [chartSettings, setChartSettings] = useState<ChartSettings>({ size: null, side: 'front', cell: 16 });
  const [instructionsSize, setInstructionsSize] = useState<string | null>(null);
  const canEdit = !pattern.myRole || pattern.myRole === 'owner';
  const hideRestored = useCallback(() => setShowRestored(false), []);
  const flow = useSaveFlow({ patternId, latest, session, editor, canEdit, onSaved: hideRestored });
  const openSave = flow.openDialog;

  const view = compiler.view;
  useEffect(() => {
    if (view && editor.current) pushDiagnostics(editor.current.view, view);
  }, [view]);

  const { update, setViews } = compiler;
  // The worker draws the chart only while its pane is showing.
  useEffect(() => {
    setViews({
      chart: pane === 'chart' ? chartSettings : null,
      instructions: pane === 'instructions' ? { size: instructionsSize } : null,
    });
  }, [pane, chartSettings, instructionsSize, setViews]);
  const { onDocChange } = session;
  const handleDocChange = useCallback((doc: string) => { onDocChange(doc); update(doc); }, [onDocChange, update]);
  const initialDoc = session.initialDoc;
  const handleReady = useCallback((h: EditorHandle | null) => {
    editor.current = h;
    if (h) update(initialDoc, true);
  }, [update, initialDoc]);
  const jump = useCallback((span: Span) => editor.current?.jumpTo(span.from, span.to), []);
  const jumpRange = useCallback((from: number, to: number) => editor.current?.jumpTo(from, to), []);
  const applyFix = useCallback((fix: QuickFix) => {
    const h = editor.current;
    if (!h || h.view.state.doc.toString() !== view?.source) return; // offsets refer to the compiled text
    h.view.dispatch({ changes: { from: fix.from, to: fix.to, insert: fix.insert }, userEvent: 'input.quickfix' });
    h.focus();
  }, [view]);

  const insertPlan = useCallback((answer: PlanAnswer) => {
    const h = editor.current;
    if (!h || !answer.plan || h.view.state.doc.toString() !== answer.source) return false;
    h.replaceDoc(answer.plan.patchedSource);
    h.focus();
    return true;
  }, []);

  const tabs: PaneTab<PaneKey>[] = [
    { key: 'counts', label: 'Counts', shortcut: 'Alt+1' },
    {
      key: 'problems', label: 'Problems', shortcut: 'Alt+2',
      badge: view && view.diagnostics.length > 0 ? (
        <span className={`rounded-full px-1.5 text-caption font-semibold ${view.diagnostics.some((d) => d.severity === 'error') ? 'bg-glasswort-600 text-white' : 'bg-mudflat-200 text-mudflat-900'}`}>
          {view.diagnostics.length}
        </span>
      ) : undefined,
    },
    { key: 'chart', label: 'Chart', shortcut: 'Alt+3' },
    { key: 'instructions', label: 'Instructions', shortcut: 'Alt+4' },
    { key: 'summary', label: 'Summary', shortcut: 'Alt+5' },
  ];

  useWorkspaceKeys({
    onSave: openSave,
    onPane: (i) => { if (tabs[i]) setPane(tabs[i].key); },
    onEditor: () => editor.current?.focus(),
    onHelp: () => setHelpOpen(true),
  });

  const inStep = view !== null && view.source === session.docRef.current;
  const hereRounds = inStep ? roundsOnLine(view, cursorLine) : [];
  const cursorSpan = useMemo(() => {
    const doc = editor.current?.view.state.doc;
    if (!inStep || !doc || cursorLine > doc.lines) return null;
    const line = doc.line(cursorLine);
    return { from: line.from, to: line.to };
  }, [inStep, cursorLine]);
  const hereLabel = hereRounds.length
    ? (() => {
      const nums = hereRounds[0].rounds.map((r) => r.number);
      const word = view?.header.construction === 'flat' ? 'Row' : 'Round';
      return nums.length > 1 ? `${word}s ${nums[0]}–${nums[nums.length - 1]}` : `${word} ${nums[0]}`;
    })()
    : null;

  return (
    <div className="flex min-h-0 flex-1 flex-col">
      <WorkspaceHeader
        title={view?.header.title ?? pattern.title}
        status={pattern.status}
        revision={flow.savedRevision}
        baseRevision={session.baseRevision}
        dirty={session.dirty}
        view={view}
        checking={compiler.pending}
        canEdit={canEdit}
        onSave={openSave}
        onShowProblems={() => setPane('problems')}
        onHelp={() => setHelpOpen(true)}
      />
      {(showRestored && session.restored) || flow.setAside !== null || !canEdit ? (
        <div className="space-y-2 border-b border-tide-200 bg-white px-4 py-2">
          {!canEdit && <Notice tone="info">You can read this pattern; only its designer saves revisions.</Notice>}
          {showRestored && session.restored && (
            <Notice tone="info">
              <span className="flex items-center gap-3">
                Restored your unsaved changes from {relativeTime(new Date(session.restored.savedAt).toISOString())}
                {session.restored.baseRevision !== latest?.number && ` (started from revision #${session.restored.baseRevision}; a newer one exists, and saving will let you compare)`}.
                <button type="button" className="ml-auto font-medium underline" onClick={() => setShowRestored(false)}>Dismiss</button>
              </span>
            </Notice>
          )}
          {flow.setAside !== null && (
            <Notice tone="info">
              <span className="flex items-center gap-3">
                Your own version is set aside in this browser.
                <button type="button" className="font-medium underline" onClick={flow.bringBack}>
                  Bring my version back
                </button>
                <button type="button" className="ml-auto font-medium underline" onClick={flow.dismissSetAside}>Dismiss</button>
              </span>
            </Notice>
          )}
        </div>
      ) : null}

      <div className="grid min-h-0 flex-1 grid-cols-[minmax(0,1fr)_minmax(26rem,44%)]">
        <section aria-label="Editor" className="flex min-h-0 min-w-0 flex-col border-r border-tide-200 bg-white">
          <div className="min-h-0 flex-1">
            <LoopEditor
              docKey={patternId}
              initialDoc={session.initialDoc}
              onDocChange={handleDocChange}
              onCursorLine={setCursorLine}
              onReady={handleReady}
              readOnly={!canEdit}
            />
          </div>
          <div className="flex h-7 shrink-0 items-center gap-4 border-t border-tide-200 bg-tide-50 px-3 text-caption text-tide-700">
            <span>Line {cursorLine}</span>
            {hereLabel && <span>{hereLabel}</span>}
            <span className="ml-auto">{view ? `Checked in ${Math.max(1, Math.round(view.elapsedMs))} ms` : 'Checking…'}</span>
          </div>
        </section>
        <section aria-label="Views of the pattern" className="flex min-h-0 min-w-0 flex-col bg-white">
          <PaneTabs tabs={tabs} selected={pane} onSelect={setPane} idPrefix="ws" />
          <div role="tabpanel" id={`ws-panel-${pane}`} aria-labelledby={`ws-tab-${pane}`} className="min-h-0 flex-1">
            {pane === 'counts' && <CountsPane view={view} cursorLine={cursorLine} onJump={jump} />}
            {pane === 'problems' && <ProblemsPane view={view} stale={compiler.pending} onJump={jump} onFix={applyFix} />}
            {pane === 'chart' && (
              <ChartPane chart={compiler.chart} sizes={view?.sizes.map((s) => s.name) ?? []} yarns={view?.header.yarns ?? []}
                settings={chartSettings} onSettings={setChartSettings}
                stale={compiler.pending || (compiler.chart !== null && view !== null && compiler.chart.id !== view.id)}
                cursorSpan={cursorSpan} onJump={jumpRange} word={view?.header.construction === 'flat' ? 'Row' : 'Round'} />
            )}
            {pane === 'summary' && (
              <Suspense fallback={<p className="p-5 text-sm text-tide-600" role="status">Loading the summary…</p>}>
                <SummaryPane compiled={view} onInsert={insertPlan}
                  word={view?.header.construction === 'flat' ? 'Row' : 'Round'} />
              </Suspense>
            )}
            {pane === 'instructions' && (
              <InstructionsPane message={compiler.instructions} sizes={view?.sizes.map((s) => s.name) ?? []} size={instructionsSize}
                onSize={setInstructionsSize} cursorLine={cursorLine} onJump={jump}
                stale={compiler.pending || (compiler.instructions !== null && view !== null && compiler.instructions.id !== view.id)} />
            )}
          </div>
        </section>
      </div>

      <SaveDialog
        open={flow.dialogOpen}
        baseRevision={session.baseRevision}
        saving={flow.saving}
        error={flow.error}
        errors={view?.diagnostics.filter((d) => d.severity === 'error').length ?? 0}
        onSave={(message) => flow.save(message)}
        onClose={flow.closeDialog}
      />
      {flow.conflict && (
        <Suspense fallback={<div role="status" className="fixed inset-0 z-50 flex items-center justify-center bg-tide-950/40 text-white">Comparing versions…</div>}>
        <ConflictDialog
          open
          mine={session.docRef.current}
          theirs={flow.conflict.theirs}
          saving={flow.saving}
          error={flow.error}
          onKeepMine={() => { if (flow.conflict) flow.save(flow.conflict.message, flow.conflict.theirs.number); }}
          onTakeTheirs={flow.takeTheirs}
          onClose={flow.closeConflict}
        />
        </Suspense>
      )}
      <HelpOverlay open={helpOpen} onClose={() => setHelpOpen(false)} panes={tabs.map((t) => t.label)} />
      {flow.toast && (
        <div role="status" className="fixed bottom-10 left-1/2 z-40 -translate-x-1/2 rounded-full bg-tide-900 px-4 py-2 text-sm text-white shadow-float">
          {flow.toast}
        </div>
      )}
    </div>
  );
}
