/** The keyboard shortcuts overlay (F1, or ? outside the editor). */
import { Dialog } from '../Dialog';
import { keyLabel, paneShortcuts, SHORTCUTS, type Shortcut } from './shortcuts';

const groups: Shortcut['group'][] = ['Saving', 'Problems', 'Panes', 'Editing', 'Chart'];

/** `panes`: labels of the workspace's panes in tab order (their Alt+digit keys are listed). */
export function HelpOverlay({ open, onClose, panes }: { open: boolean; onClose: () => void; panes: readonly string[] }) {
  const all = [...paneShortcuts(panes), ...SHORTCUTS];
  return (
    <Dialog open={open} title="Keyboard shortcuts" onClose={onClose} width="w-[44rem]">
      <div className="grid grid-cols-2 gap-x-8 gap-y-5">
        {groups.map((g) => (
          <section key={g} aria-label={g}>
            <h3 className="text-caption font-semibold uppercase tracking-wide text-tide-600">{g}</h3>
            <dl className="mt-2 space-y-2">
              {all.filter((s) => s.group === g).map((s) => (
                <div key={s.label} className="flex items-start justify-between gap-3 text-sm">
                  <dt className="text-tide-800">{s.label}</dt>
                  <dd className="flex shrink-0 gap-1">
                    {s.keys.map((k) => <kbd key={k} className="kbd">{keyLabel(k)}</kbd>)}
                  </dd>
                </div>
              ))}
            </dl>
          </section>
        ))}
      </div>
      <p className="mt-5 text-caption text-tide-600">
        Hover over a round's line to see its counts in every size. Unsaved changes are kept in this browser.
      </p>
    </Dialog>
  );
}
