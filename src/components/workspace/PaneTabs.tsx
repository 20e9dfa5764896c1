/**
 * Tabs for the workspace's right-hand panes (WAI-ARIA tabs pattern: arrow
 * keys move between tabs, the selected tab is the one in the tab order).
 */
import { useRef, type KeyboardEvent, type ReactNode } from 'react';

export interface PaneTab<K extends string> {
  key: K;
  label: string;
  /** A small count shown after the label (for example the number of problems). */
  badge?: ReactNode;
  shortcut?: string;
}

export function PaneTabs<K extends string>({ tabs, selected, onSelect, idPrefix }: { tabs: PaneTab<K>[]; selected: K; onSelect: (k: K) => void; idPrefix: string }) {
  const refs = useRef(new Map<K, HTMLButtonElement>());
  const onKey = (e: KeyboardEvent, index: number) => {
    let next = -1;
    if (e.key === 'ArrowRight') next = (index + 1) % tabs.length;
    else if (e.key === 'ArrowLeft') next = (index - 1 + tabs.length) % tabs.length;
    else if (e.key === 'Home') next = 0;
    else if (e.key === 'End') next = tabs.length - 1;
    if (next < 0) return;
    e.preventDefault();
    onSelect(tabs[next].key);
    refs.current.get(tabs[next].key)?.focus();
  };
  return (
    <div role="tablist" aria-label="Views of the pattern" className="flex shrink-0 items-end gap-1 border-b border-tide-200 bg-tide-50 px-2 pt-1.5">
      {tabs.map((t, i) => {
        const active = t.key === selected;
        return (
          <button
            key={t.key}
            ref={(el) => { if (el) refs.current.set(t.key, el); else refs.current.delete(t.key); }}
            type="button"
            role="tab"
            id={`${idPrefix}-tab-${t.key}`}
            aria-selected={active}
            aria-controls={`${idPrefix}-panel-${t.key}`}
            tabIndex={active ? 0 : -1}
            title={t.shortcut ? `${t.label} (${t.shortcut})` : t.label}
            onClick={() => onSelect(t.key)}
            onKeyDown={(e) => onKey(e, i)}
            className={`-mb-px flex items-center gap-1.5 rounded-t-stitch border px-3 py-1.5 text-sm font-medium ${
              active ? 'border-tide-200 border-b-white bg-white text-tide-900' : 'border-transparent text-tide-700 hover:text-tide-900'
            }`}
          >
            {t.label}
            {t.badge}
          </button>
        );
      })}
    </div>
  );
}
