/**
 * The workspace's keyboard shortcuts, listed once for the help overlay.
 * Editor-level keys (save, problems) are bound in the editor keymap;
 * pane keys are handled at the window level so they work from anywhere.
 */

/** True on Apple platforms, where "Mod" is the Command key. */
export const isMac = typeof navigator !== 'undefined' && /Mac|iPhone|iPad/.test(navigator.platform || navigator.userAgent);

/** Key names as shown to the person ("Mod" becomes Ctrl or ⌘). */
export function keyLabel(key: string): string {
  if (key === 'Mod') return isMac ? '⌘' : 'Ctrl';
  if (key === 'Alt') return isMac ? '⌥' : 'Alt';
  return key;
}

/** The pane shortcuts for the panes a workspace has, in tab order (Alt+1, Alt+2, …). */
export function paneShortcuts(paneLabels: readonly string[]): Shortcut[] {
  return paneLabels.slice(0, 9).map((label, i) => ({ keys: ['Alt', String(i + 1)], label: `Show the ${label} pane`, group: 'Panes' }));
}

/** One documented shortcut. */
export interface Shortcut {
  keys: string[];
  label: string;
  group: 'Saving' | 'Problems' | 'Panes' | 'Editing' | 'Chart';
}

export const SHORTCUTS: readonly Shortcut[] = [
  { keys: ['Mod', 'S'], label: 'Save a revision (asks for a message)', group: 'Saving' },
  { keys: ['F8'], label: 'Go to the next problem', group: 'Problems' },
  { keys: ['Shift', 'F8'], label: 'Go to the previous problem', group: 'Problems' },
  { keys: ['Alt', '0'], label: 'Move focus back to the editor', group: 'Panes' },
  { keys: ['Ctrl', 'Space'], label: 'Suggest stitches, keywords and names', group: 'Editing' },
  { keys: ['Mod', 'F'], label: 'Find and replace', group: 'Editing' },
  { keys: ['Alt', '↑'], label: 'Move the line up (↓ down)', group: 'Editing' },
  { keys: ['Mod', 'Z'], label: 'Undo', group: 'Editing' },
  { keys: ['Mod', 'Shift', 'Z'], label: 'Redo', group: 'Editing' },
  { keys: ['Tab'], label: 'Leave the editor for the next control', group: 'Editing' },
  { keys: ['F1'], label: 'Show this list (or ? outside the editor)', group: 'Editing' },
  // In the chart pane, once Tab has reached the chart (components/chart/useChartGrid.ts).
  { keys: ['←', '→', '↑', '↓'], label: 'Move between stitches', group: 'Chart' },
  { keys: ['Home', 'End'], label: 'Ends of the round (with Ctrl: of the chart)', group: 'Chart' },
  { keys: ['PgUp', 'PgDn'], label: 'Ten rounds up or down', group: 'Chart' },
  { keys: ['Enter'], label: 'Go to the stitch’s line', group: 'Chart' },
];
