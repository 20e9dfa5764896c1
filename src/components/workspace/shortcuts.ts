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

/** One documented shortcut. */
export interface Shortcut {
  keys: string[];
  label: string;
  group: 'Saving' | 'Problems' | 'Panes' | 'Editing';
}

export const SHORTCUTS: readonly Shortcut[] = [
  { keys: ['Mod', 'S'], label: 'Save a revision (asks for a message)', group: 'Saving' },
  { keys: ['F8'], label: 'Go to the next problem', group: 'Problems' },
  { keys: ['Shift', 'F8'], label: 'Go to the previous problem', group: 'Problems' },
  { keys: ['Alt', '1'], label: 'Show the Counts pane', group: 'Panes' },
  { keys: ['Alt', '2'], label: 'Show the Problems pane', group: 'Panes' },
  { keys: ['Alt', '3'], label: 'Show the Chart pane (when available)', group: 'Panes' },
  { keys: ['Alt', '4'], label: 'Show the Instructions pane (when available)', group: 'Panes' },
  { keys: ['Alt', '0'], label: 'Move focus back to the editor', group: 'Panes' },
  { keys: ['Ctrl', 'Space'], label: 'Suggest stitches, keywords and names', group: 'Editing' },
  { keys: ['Mod', 'F'], label: 'Find and replace', group: 'Editing' },
  { keys: ['Mod', 'Z'], label: 'Undo', group: 'Editing' },
  { keys: ['Mod', 'Shift', 'Z'], label: 'Redo', group: 'Editing' },
  { keys: ['F1'], label: 'Show this list (or ? outside the editor)', group: 'Editing' },
];
