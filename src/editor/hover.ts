/**
 * Hover on a round's line: its counts in every size (front, backing,
 * total, longest float), from the newest compile answer.
 */
import { hoverTooltip, type Tooltip } from '@codemirror/view';
import { compiledField } from './compile-state';
import { floatLimitStitches, roundsOnLine } from './rounds';

/** Most rounds listed per size before "and N more" (a long range of rounds). */
const MAX_ROWS_PER_SIZE = 4;

function cell(tag: 'td' | 'th', text: string, className = ''): HTMLTableCellElement {
  const el = document.createElement(tag);
  el.textContent = text;
  if (className) el.className = className;
  if (tag === 'th') el.setAttribute('scope', 'col');
  return el;
}

/** The round-counts hover extension. */
export const roundHover = hoverTooltip(
  (view, pos): Tooltip | null => {
    const compiled = view.state.field(compiledField, false);
    if (!compiled || compiled.source !== view.state.doc.toString()) return null;
    const line = view.state.doc.lineAt(pos);
    const found = roundsOnLine(compiled, line.number);
    if (!found.length) return null;
    const limit = floatLimitStitches(compiled.header);
    return {
      pos: line.from,
      end: line.to,
      above: true,
      create: () => {
        const dom = document.createElement('div');
        dom.className = 'lw-round-hover';
        const table = document.createElement('table');
        const head = document.createElement('tr');
        const word = compiled.header.construction === 'flat' ? 'Row' : 'Round';
        for (const h of ['Size', word, 'Front', 'Backing', 'Total', 'Longest float']) head.append(cell('th', h));
        const thead = document.createElement('thead');
        thead.append(head);
        const body = document.createElement('tbody');
        for (const { size, rounds } of found) {
          rounds.slice(0, MAX_ROWS_PER_SIZE).forEach((r, i) => {
            const tr = document.createElement('tr');
            tr.append(cell('td', i === 0 ? size : '', 'lw-size'));
            tr.append(cell('td', `${r.number}${r.side === 'WS' ? ' (WS)' : ''}`));
            tr.append(cell('td', String(r.front)));
            tr.append(cell('td', String(r.backing)));
            tr.append(cell('td', String(r.total), 'lw-total'));
            const f = r.longestFloat;
            const long = f && limit !== null && f.stitches > limit;
            tr.append(cell('td', f ? `${f.stitches} sts in ${f.yarn}` : '—', long ? 'lw-long' : ''));
            body.append(tr);
          });
          if (rounds.length > MAX_ROWS_PER_SIZE) {
            const tr = document.createElement('tr');
            const td = cell('td', `…and ${rounds.length - MAX_ROWS_PER_SIZE} more ${word.toLowerCase()}s`, 'lw-more');
            td.colSpan = 6;
            tr.append(td);
            body.append(tr);
          }
        }
        table.append(thead, body);
        dom.append(table);
        return { dom };
      },
    };
  },
  { hoverTime: 350 },
);
