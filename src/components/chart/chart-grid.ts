/**
 * Keyboard access to a chart SVG drawn by shared/render: the drawing
 * becomes an ARIA grid (the WAI-ARIA Authoring Practices "data grid"
 * pattern) with one tab stop that roves from cell to cell.
 *
 * The renderer's structure is read, not changed in meaning:
 * - front view: `g.cells > g.row[data-round]`, one child per chart column
 *   (left to right), stitch cells with data-stitch / data-from / data-to, and
 *   no-stitch cells without them. Rows are drawn bottom-up (round 1 first).
 * - back view: `g.cells > g.backing[data-round]` cells for backing stitches
 *   only; when the grid is prepared they are gathered into one row group per
 *   round (they do not overlap the plain strips, so the drawing is the same).
 *
 * Cost: the grid role and the one tab stop are placed by tab-stop.ts, O(1)
 * per drawing, so redrawing on every keystroke stays cheap; this module is
 * fetched once a chart is drawn (useChartGrid.ts), and its O(cells) work
 * (reading the navigation index, no writes) runs once per drawing, when the
 * keyboard first enters the grid ({@link ChartGrid.prepare}). Roles, names
 * and positions are written for the focused cell only.
 *
 * Arrow keys move as the drawing looks: Up is the next round (drawn above),
 * Left and Right follow the columns on screen. Home/End go to the ends of
 * the row, Ctrl+Home/Ctrl+End to the top-left and bottom-right cells,
 * PageUp/PageDown ten rounds (the thick grid lines are ten apart).
 */
import { findCell, isBackView, markTabStop, num, roundOf, isStitchCell, type GridSpot } from './tab-stop';

const SVG_NS = 'http://www.w3.org/2000/svg';

/** A yarn as the pattern declares it (name "A", label "Sea lavender", colour "#6a5397"). */
export interface GridYarn { name: string; label: string; colour: string }

/** Wording and hints of one chart view. */
export interface ChartGridOptions {
  /** "Round" for work in the round, "Row" for flat work. */
  word: 'Round' | 'Row';
  /** Accessible name of the grid. */
  label: string;
  /** What Enter or Space does on a stitch cell, read after its name ("Enter: go to its line"). */
  hint: string;
  /** Yarns to name a cell's colour; when absent they are read from the chart's own key. */
  yarns?: readonly GridYarn[];
}

/** Keys the grid handles (anything else is left to the page). */
export type GridKey = 'ArrowLeft' | 'ArrowRight' | 'ArrowUp' | 'ArrowDown' | 'Home' | 'End' | 'PageUp' | 'PageDown';

/** One chart drawing made operable by keyboard. */
export class ChartGrid {
  readonly svg: SVGSVGElement;
  private readonly opts: ChartGridOptions;
  private readonly group: Element | null;
  private readonly back: boolean;
  private rows: Element[][] | null = null;
  private readonly at = new WeakMap<Element, [number, number]>();
  private active: Element | null = null;
  private ring: HTMLDivElement | null = null;
  /** Positioned element around the drawing that holds the focus ring (the scroll container). */
  ringHost: HTMLElement | null = null;
  private yarnByColour: Map<string, GridYarn> | null = null;
  private symbolNames: Map<string, { abbreviation: string; meaning: string }> | null = null;

  /** A grid over `svg`, whose tab stop tab-stop.ts placed on `tabStop`. */
  constructor(svg: SVGSVGElement, opts: ChartGridOptions, tabStop: Element) {
    this.svg = svg;
    this.opts = opts;
    this.group = svg.querySelector('g.cells');
    this.back = this.group ? isBackView(this.group) : false;
    this.setActive(tabStop);
  }

  /** Moves the tab stop to stitch 1 of `round` (when that round is drawn). */
  startAt(round: number): void {
    const cell = this.group ? findCell(this.group, null, round) : null;
    if (cell && roundOf(cell) === round) this.setActive(cell);
  }

  /** Renames the grid (e.g. when the knitter's current round changes). */
  setLabel(label: string): void {
    if (this.group?.getAttribute('role') === 'grid') this.group.setAttribute('aria-label', label);
  }

  /**
   * The navigation index; runs once per drawing (O(cells), reads only). Cells
   * get their role and position when they become the tab stop, as in a grid
   * whose rows are not all in the page (WAI-ARIA `aria-rowcount`,
   * `aria-rowindex`): writing an attribute on every cell of a large chart
   * makes the browser restyle and repaint all of them.
   */
  prepare(): void {
    if (this.rows || !this.group) return;
    const rows = (this.back ? this.backRows() : [...this.group.children].filter((r) => r.matches('g.row')).reverse().map((r) => [...r.children]))
      .filter((cells) => cells.length > 0);
    rows.forEach((cells, r) => cells.forEach((cell, c) => this.at.set(cell, [r, c])));
    this.rows = rows;
    this.group.setAttribute('aria-rowcount', String(rows.length));
    this.group.setAttribute('aria-colcount', String(this.back ? this.columnCount() : Math.max(0, ...rows.map((cells) => cells.length))));
  }

  /** Back view: one row group per round, placed where the round's first backing cell was. */
  private backRows(): Element[][] {
    const byRound = new Map<number, Element[]>();
    for (const cell of this.group!.querySelectorAll(':scope > g.backing[data-round], :scope > g[role="row"] > g.backing')) {
      const round = roundOf(cell);
      const list = byRound.get(round) ?? [];
      list.push(cell);
      byRound.set(round, list);
    }
    for (const cells of byRound.values()) {
      if (cells[0]!.parentElement !== this.group) continue;
      const row = document.createElementNS(SVG_NS, 'g');
      this.group!.insertBefore(row, cells[0]!);
      for (const cell of cells) row.append(cell);
    }
    return [...byRound.entries()].sort((a, b) => b[0] - a[0]).map(([, cells]) => cells.sort((a, b) => num(a, 'x') - num(b, 'x')));
  }

  /** The cell `key` leads to from the active one (null when it stays put). */
  move(key: GridKey, ctrl: boolean): Element | null {
    this.prepare();
    const rows = this.rows!;
    const from = this.active ? this.at.get(this.active) : undefined;
    if (!from || !rows.length) return null;
    const [r, c] = from;
    const row = rows[r]!;
    const inRow = (target: number, col: number): Element | null => {
      const t = Math.max(0, Math.min(rows.length - 1, target));
      if (t === r) return row[col] ?? null;
      const cells = rows[t]!;
      if (!this.back) return cells[Math.min(col, cells.length - 1)] ?? null;
      // Back view: rows hold only backing cells; go to the one nearest on screen.
      const x = num(row[col]!, 'x');
      return cells.reduce((best, cell) => (Math.abs(num(cell, 'x') - x) < Math.abs(num(best, 'x') - x) ? cell : best));
    };
    let next: Element | null = null;
    switch (key) {
      case 'ArrowLeft': next = row[c - 1] ?? null; break;
      case 'ArrowRight': next = row[c + 1] ?? null; break;
      case 'ArrowUp': next = r > 0 ? inRow(r - 1, c) : null; break;
      case 'ArrowDown': next = r < rows.length - 1 ? inRow(r + 1, c) : null; break;
      case 'PageUp': next = inRow(r - 10, c); break;
      case 'PageDown': next = inRow(r + 10, c); break;
      case 'Home': next = ctrl ? rows[0]![0]! : row[0]!; break;
      case 'End': next = ctrl ? rows[rows.length - 1]!.at(-1)! : row.at(-1)!; break;
    }
    return next && next !== this.active ? next : null;
  }

  /** The cell holding the tab stop. */
  get activeCell(): Element | null {
    return this.active;
  }

  /** Where the tab stop is, to find the same place in the next drawing. */
  spot(): GridSpot | null {
    const el = this.active;
    if (!el) return null;
    const row = el.parentElement;
    return { round: roundOf(el), column: row ? [...row.children].indexOf(el) : 0 };
  }

  /** True when `el` is one of this grid's cells (a child of a row of `g.cells`). */
  owns(el: Element | null): el is Element {
    if (!el || !this.group) return false;
    if (this.rows) return this.at.has(el);
    const parent = el.parentElement;
    return parent === this.group ? el.classList.contains('backing') : parent?.parentElement === this.group;
  }

  /** Moves the tab stop to `cell` and names it (role, label, description). */
  setActive(cell: Element): void {
    const { name, description } = this.describe(cell);
    markTabStop(cell, this.group ?? this.svg, this.active, name);
    cell.setAttribute('aria-description', description);
    // The grid draws its own ring over the chart; the page's outline would be painted inside the SVG.
    (cell as SVGElement).style.outline = 'none';
    const at = this.at.get(cell);
    if (at && this.rows) {
      // Row 1 is round 1 (the rows' order in the page); columns count from the left as drawn.
      cell.parentElement?.setAttribute('aria-rowindex', String(this.rows.length - at[0]));
      cell.setAttribute('aria-colindex', String(this.back ? this.columnCount() - this.columnFromRight(cell) + 1 : at[1] + 1));
    }
    this.active = cell;
  }

  /** Columns of the chart (the back view's white ground spans all of them). */
  private columnCount(): number {
    const size = Number(this.svg.querySelector('#cell')?.getAttribute('width') ?? 16);
    const ground = this.group?.querySelector(':scope > rect');
    return ground ? Math.round(Number(ground.getAttribute('width')) / size) : 0;
  }

  /** Focuses `cell` (it becomes the tab stop) and shows the focus ring when the keyboard put it there. */
  focus(cell: Element): void {
    this.setActive(cell);
    (cell as SVGElement).focus({ preventScroll: true });
    cell.scrollIntoView({ block: 'nearest', inline: 'nearest' });
    this.showRing(cell);
  }

  /**
   * Draws the focus ring around `cell` (white halo outside a sea-lavender
   * line, visible on any yarn) when the keyboard put the focus there. The
   * ring is an HTML element over the drawing, not part of it: changing
   * anything inside a large SVG makes the browser repaint all of it.
   */
  showRing(cell: Element): void {
    if (!cell.matches(':focus-visible')) { this.hideRing(); return; }
    const host = this.ringHost;
    if (!host) return;
    if (!this.ring) {
      const ring = document.createElement('div');
      ring.className = 'pointer-events-none absolute left-0 top-0 z-10 rounded-[2px] border-2 border-lavender-700 shadow-[0_0_0_2px_#ffffff] will-change-transform';
      ring.setAttribute('aria-hidden', 'true');
      ring.dataset.testid = 'chart-focus';
      this.ring = ring;
    }
    const box = cell.getBoundingClientRect();
    const origin = host.getBoundingClientRect();
    const x = box.left - origin.left + host.scrollLeft - host.clientLeft - 2;
    const y = box.top - origin.top + host.scrollTop - host.clientTop - 2;
    this.ring.style.width = `${box.width + 4}px`;
    this.ring.style.height = `${box.height + 4}px`;
    this.ring.style.transform = `translate(${x}px, ${y}px)`;
    if (this.ring.parentElement !== host) host.append(this.ring);
  }


  /** Gives up the tab stop (this drawing is being replaced or re-marked). */
  release(): void {
    this.active?.removeAttribute('tabindex');
    this.active = null;
    this.hideRing();
  }

  /** Removes the focus ring (focus left the grid). */
  hideRing(): void {
    this.ring?.remove();
  }

  /** Name ("Round 6, stitch 12: k2tog, yarn B Foam") and description (the symbol's meaning and what Enter does). */
  describe(cell: Element): { name: string; description: string } {
    const { word, hint } = this.opts;
    const round = roundOf(cell);
    if (!isStitchCell(cell)) return { name: `${word} ${round}, column ${this.columnFromRight(cell)}: no stitch`, description: 'No stitch here: skip this cell.' };
    const href = cell.tagName.toLowerCase() === 'use' ? null : cell.querySelector('use[href^="#sym-"]')?.getAttribute('href');
    const def = this.symbols().get(href ? href.slice(5) : 'knit');
    const backing = cell.classList.contains('backing');
    const stitch = cell.getAttribute('data-stitch');
    const fill = (cell.getAttribute('fill') ?? cell.firstElementChild?.getAttribute('fill') ?? '').toLowerCase();
    const yarn = this.yarns().get(fill);
    const op = def ? def.abbreviation || def.meaning : (href ?? '#sym-stitch').slice(5).replace(/-/g, ' ');
    const where = stitch ? `stitch ${stitch}` : `column ${this.columnFromRight(cell)}`;
    const name = `${word} ${round}, ${where}: ${op}${backing ? ', backing stitch' : ''}${yarn ? `, yarn ${yarn.name} ${yarn.label}` : ''}`;
    return { name, description: `${def ? `${def.meaning}. ` : ''}${hint}` };
  }

  /** Column of `cell` counted from the chart's right edge, as the numbers under the chart count (1 = rightmost). */
  private columnFromRight(cell: Element): number {
    const size = Number(this.svg.querySelector('#cell')?.getAttribute('width') ?? 16);
    const last = this.group?.querySelector(':scope > g.row')?.lastElementChild;
    // The back view has no rows of every column; its white ground spans the grid.
    const ground = last ? null : this.group?.querySelector(':scope > rect');
    const right = last ? num(last, 'x') : ground ? num(ground, 'x') + Number(ground.getAttribute('width')) - size : num(cell, 'x');
    return Math.round((right - num(cell, 'x')) / size) + 1;
  }

  /**
   * What each symbol is called, read from the chart's own key (each line: the
   * symbol drawn with <use href="#sym-ID">, then "abbreviation: meaning"), so
   * the words are the renderer's. Plain cells are knit stitches, whose key
   * line has no symbol: it is the line that starts with "k: ".
   */
  private symbols(): Map<string, { abbreviation: string; meaning: string }> {
    if (this.symbolNames) return this.symbolNames;
    const names = new Map<string, { abbreviation: string; meaning: string }>();
    const split = (t: string) => { const i = t.indexOf(': '); return i < 0 ? { abbreviation: '', meaning: t } : { abbreviation: t.slice(0, i), meaning: t.slice(i + 2) }; };
    let pending: string | null = null;
    for (const el of this.svg.querySelectorAll('g.legend > *')) {
      const tag = el.tagName.toLowerCase();
      if (tag === 'use') pending = el.getAttribute('href')?.replace(/^#sym-/, '') ?? null;
      else if (tag === 'text') {
        const t = el.textContent ?? '';
        if (pending) names.set(pending, split(t));
        else if (t.startsWith('k: ') && !names.has('knit')) names.set('knit', split(t));
        pending = null;
      }
    }
    if (!names.has('knit')) names.set('knit', { abbreviation: 'k', meaning: 'knit' });
    this.symbolNames = names;
    return names;
  }

  private yarns(): Map<string, GridYarn> {
    if (this.yarnByColour) return this.yarnByColour;
    const list: GridYarn[] = this.opts.yarns ? [...this.opts.yarns] : [];
    if (!this.opts.yarns) {
      // The chart's key says "A: Sea lavender (#6a5397)" for each yarn.
      for (const t of this.svg.querySelectorAll('g.legend text')) {
        const m = /^([^:]+): (.+) \((#[0-9a-fA-F]{3,8})\)$/.exec(t.textContent ?? '');
        if (m) list.push({ name: m[1]!, label: m[2]!, colour: m[3]! });
      }
    }
    this.yarnByColour = new Map(list.map((y) => [y.colour.toLowerCase(), y]));
    return this.yarnByColour;
  }
}
