/**
 * Header changes: title, designer, construction, gauge, float limit, sizes
 * (added, removed, reordered) and yarns (added, removed, recoloured,
 * relabelled; yarns are matched by their short name).
 */
import type { PatternHeader } from '../types';
import type { Change, HeaderDiff } from './types';

function changed<T>(o: T, n: T, same: (x: T, y: T) => boolean): Change<T> | null {
  return same(o, n) ? null : { old: o, new: n };
}

const sameGauge = (x: PatternHeader['gauge'], y: PatternHeader['gauge']) =>
  x === y || (!!x && !!y && x.stitches === y.stitches && x.rows === y.rows && x.per === y.per);
const byName = (x: { name: string }, y: { name: string }) => (x.name < y.name ? -1 : x.name > y.name ? 1 : 0);
const sameLimit = (x: PatternHeader['floatLimit'], y: PatternHeader['floatLimit']) => x.value === y.value && x.unit === y.unit;

/** Compares two headers. Colours compare case-insensitively (#1D3557 = #1d3557). */
export function diffHeader(o: PatternHeader, n: PatternHeader): HeaderDiff {
  const oldSizes = new Set(o.sizes), newSizes = new Set(n.sizes);
  const common = o.sizes.filter((s) => newSizes.has(s));
  const commonNew = n.sizes.filter((s) => oldSizes.has(s));
  const oldYarns = new Map(o.yarns.map((y) => [y.name, y])), newYarns = new Map(n.yarns.map((y) => [y.name, y]));
  const recoloured: HeaderDiff['yarns']['recoloured'] = [];
  const relabelled: HeaderDiff['yarns']['relabelled'] = [];
  for (const y of n.yarns) {
    const before = oldYarns.get(y.name);
    if (!before) continue;
    if (before.colour.toLowerCase() !== y.colour.toLowerCase()) recoloured.push({ name: y.name, old: before.colour, new: y.colour });
    if (before.label !== y.label) relabelled.push({ name: y.name, old: before.label, new: y.label });
  }
  const copy = (y: PatternHeader['yarns'][number]) => ({ name: y.name, label: y.label, colour: y.colour });
  return {
    title: changed(o.title, n.title, (x, y) => x === y),
    designer: changed(o.designer, n.designer, (x, y) => x === y),
    construction: changed(o.construction, n.construction, (x, y) => x === y),
    gauge: changed(o.gauge ? { ...o.gauge } : null, n.gauge ? { ...n.gauge } : null, sameGauge),
    floatLimit: changed({ ...o.floatLimit }, { ...n.floatLimit }, sameLimit),
    sizes: {
      added: n.sizes.filter((s) => !oldSizes.has(s)),
      removed: o.sizes.filter((s) => !newSizes.has(s)),
      order: common.join('\u0000') === commonNew.join('\u0000') ? null : { old: common, new: commonNew },
    },
    yarns: {
      added: n.yarns.filter((y) => !oldYarns.has(y.name)).map(copy),
      removed: o.yarns.filter((y) => !newYarns.has(y.name)).map(copy),
      // By name, so the order does not depend on which revision is 'old'.
      recoloured: recoloured.sort(byName),
      relabelled: relabelled.sort(byName),
    },
  };
}

/** True when a header diff holds any change. */
export function isHeaderChanged(h: HeaderDiff): boolean {
  return !!(h.title || h.designer || h.construction || h.gauge || h.floatLimit || h.sizes.order
    || h.sizes.added.length || h.sizes.removed.length
    || h.yarns.added.length || h.yarns.removed.length || h.yarns.recoloured.length || h.yarns.relabelled.length);
}
