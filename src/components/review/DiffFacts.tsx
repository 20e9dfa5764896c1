/**
 * Header changes (title, designer, construction, gauge, float limit, sizes,
 * yarns) and the problems a revision introduced or fixed, in plain words.
 */
import type { DiagnosticRef, HeaderDiff, RevisionDiff } from '../../../shared/diff/types';

function gauge(g: HeaderDiff['gauge'] extends infer C ? C extends { old: infer T } ? T : never : never): string {
  return g ? `${g.stitches} sts and ${g.rows} rows per ${g.per === '10cm' ? '10 cm' : '4 in'}` : 'none';
}

/** Plain sentences for every changed header field (empty when nothing changed). */
export function headerLines(h: HeaderDiff): string[] {
  const out: string[] = [];
  if (h.title) out.push(`Title: “${h.title.old ?? '—'}” → “${h.title.new ?? '—'}”`);
  if (h.designer) out.push(`Designer: ${h.designer.old ?? '—'} → ${h.designer.new ?? '—'}`);
  if (h.construction) out.push(`Worked ${h.construction.old === 'flat' ? 'flat' : 'in the round'} → ${h.construction.new === 'flat' ? 'flat' : 'in the round'}`);
  if (h.gauge) out.push(`Gauge: ${gauge(h.gauge.old)} → ${gauge(h.gauge.new)}`);
  if (h.floatLimit) out.push(`Float limit: ${h.floatLimit.old.value} ${h.floatLimit.old.unit} → ${h.floatLimit.new.value} ${h.floatLimit.new.unit}`);
  if (h.sizes.added.length) out.push(`Sizes added: ${h.sizes.added.join(', ')}`);
  if (h.sizes.removed.length) out.push(`Sizes removed: ${h.sizes.removed.join(', ')}`);
  if (h.sizes.order) out.push(`Size order: ${h.sizes.order.old.join(' ')} → ${h.sizes.order.new.join(' ')}`);
  for (const y of h.yarns.added) out.push(`Yarn ${y.name} added (“${y.label}”, ${y.colour})`);
  for (const y of h.yarns.removed) out.push(`Yarn ${y.name} removed (“${y.label}”)`);
  for (const y of h.yarns.recoloured) out.push(`Yarn ${y.name} recoloured ${y.old} → ${y.new}`);
  for (const y of h.yarns.relabelled) out.push(`Yarn ${y.name} renamed “${y.old}” → “${y.new}”`);
  return out;
}

function DiagList({ items, tone }: { items: DiagnosticRef[]; tone: 'introduced' | 'fixed' }) {
  return (
    <ul className="mt-1 space-y-1">
      {items.map((d, i) => (
        <li key={i} className={`rounded-stitch border px-2 py-1 text-sm ${tone === 'introduced' ? 'border-glasswort-200 bg-glasswort-50 text-glasswort-800' : 'border-samphire-200 bg-samphire-50 text-samphire-800'}`}>
          <span className="font-mono text-caption">{d.code}</span> {d.severity} · line {d.line}{d.size ? ` · size ${d.size}` : ''}: {d.message}
        </li>
      ))}
    </ul>
  );
}

export function DiffFacts({ diff }: { diff: RevisionDiff }) {
  const lines = headerLines(diff.header);
  const { introduced, fixed } = diff.diagnostics;
  return (
    <div className="space-y-3 px-4 py-3" data-testid="diff-facts">
      <div>
        <h3 className="text-caption font-semibold uppercase tracking-wide text-tide-600">Header</h3>
        {lines.length === 0 ? <p className="mt-1 text-sm text-tide-600">No header changes.</p> : (
          <ul className="mt-1 list-disc pl-5 text-sm">{lines.map((l) => <li key={l}>{l}</li>)}</ul>
        )}
      </div>
      <div>
        <h3 className="text-caption font-semibold uppercase tracking-wide text-tide-600">Problems</h3>
        {introduced.length === 0 && fixed.length === 0 && (
          <p className="mt-1 text-sm text-tide-600">No problems introduced or fixed{diff.diagnostics.unchanged ? ` (${diff.diagnostics.unchanged} unchanged)` : ''}.</p>
        )}
        {introduced.length > 0 && <><p className="mt-1 text-sm font-medium text-glasswort-700">Introduced ({introduced.length})</p><DiagList items={introduced} tone="introduced" /></>}
        {fixed.length > 0 && <><p className="mt-2 text-sm font-medium text-samphire-700">Fixed ({fixed.length})</p><DiagList items={fixed} tone="fixed" /></>}
      </div>
    </div>
  );
}
