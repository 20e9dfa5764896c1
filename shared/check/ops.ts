/**
 * The stitch machine, operations: interprets a line's operation list on the
 * machine (machine.ts) over the current scope [pos, end): stitch runs,
 * repeats (times, to end, to last n, to marker, nested), chart rows,
 * markers, catches and hand-placed backing stitches (raise, carry, close).
 */
import { OP, STITCHES, type Op, type StitchInfo, type ToSpec } from '../notation';
import type { Span } from '../types';
import type { Machine } from './machine';
import { FLAG } from './store';
import { LIMITS } from './context';
import type { ChartRow } from './charts';

import { closestName, type Facts } from '../diagnostics';

const sizeFacts = (m: Machine): Facts => (m.scopeName ? { word: m.word, round: m.roundNo, segment: m.scopeName } : { word: m.word, round: m.roundNo });

/**
 * Reports a finding of the round being worked: its word, round (and segment)
 * then `extra`. A repeat from the same place (an operation that meets the
 * same problem on every pass of a long repeat) returns before the facts are
 * built.
 */
function reportRound(m: Machine, code: string, span: Span, extra: Facts, key = '', related?: { span: Span; message: string }[]): void {
  if (m.ctx.repeat(code, span, key)) return;
  m.ctx.report(code, span, { ...sizeFacts(m), ...extra }, key, related);
}

/** Works one stitch operation once: takes what it consumes, puts what it produces. */
export function workStitch(m: Machine, info: StitchInfo, yarn: number, src: number, flags: number): number {
  const c = info.consumes;
  let got = 0;
  for (let j = 0; j < c; j++) {
    if (m.takeFront(src, info.name) < 0) break;
    got++;
  }
  m.worked += c;
  if (got < c) {
    m.missing += c - got;
    if (c > 1 && got > 0) {
      reportRound(m, 'LW303', m.sources.spans[src], { stitch: info.name, needs: c, left: got });
      m.problem = true;
    }
    if (got === 0) return 0;
  }
  for (let j = 0; j < info.produces; j++) m.putFront(info.code, yarn, src, flags);
  return got;
}

/** Where a "to ..." run stops: the input index, or -1 after a diagnostic. */
function target(m: Machine, to: ToSpec, span: Span): number {
  if (to.kind === 'end') return m.end;
  if (to.kind === 'last') return m.end; // the caller keeps n back
  for (let k = m.mi; k < m.markersIn.length; k++) {
    const mk = m.markersIn[k];
    if (mk.at > m.end) break;
    if (mk.at >= m.pos && (!to.name || mk.name === to.name.name)) return mk.at;
  }
  if (!to.name) {
    // In a segment, the next marker is the segment's end.
    if (m.scopeName !== null || m.end < m.inLen) return m.end;
    reportRound(m, 'LW307', span, { detail: 'there is no marker ahead before the end of the round' });
    return -1;
  }
  if (!m.ctx.repeat('LW205', to.name.span)) {
    const known = [...new Set(m.markersIn.map((x) => x.name))].join(', ');
    m.ctx.report('LW205', to.name.span, { round: m.roundNo, name: to.name.name, known });
  }
  return -1;
}

/** How many stitches remain for a "to ..." run, or -1 after a diagnostic. */
function available(m: Machine, to: ToSpec, span: Span): number {
  const t = target(m, to, span);
  if (t < 0) return -1;
  let n = m.fronts(m.pos, t);
  if (to.kind === 'last') {
    const keep = m.ctx.graded(to.n);
    if (keep > n) {
      reportRound(m, 'LW303', span, { stitch: `"to last ${keep}"`, needs: keep, left: n });
      m.problem = true;
      return -1;
    }
    n -= keep;
  }
  return n;
}

/** Front stitches one pass of `ops` takes, or null when it depends on the needle ("to end" inside). */
export function consumption(m: Machine, ops: readonly Op[]): number | null {
  let total = 0;
  for (const op of ops) {
    switch (op.type) {
      case 'stitch':
        if (op.to) return null;
        total += op.stitch.consumes * (op.count ? m.ctx.graded(op.count) : 1);
        break;
      case 'group': {
        const inner = consumption(m, op.ops);
        if (inner === null || (op.repeat.kind !== 'times' && op.repeat.kind !== 'once')) return null;
        total += inner * (op.repeat.kind === 'times' ? m.ctx.graded(op.repeat.n) : 1);
        break;
      }
      case 'chart': {
        if (!op.once) return null;
        const row = chartRow(m, op, false);
        total += row ? row.consumes : 0;
        break;
      }
      case 'close': total += 1; break; // the front neighbour
      case 'cable': total += op.held + op.worked; break;
      default: break;
    }
  }
  return total;
}

/** The chart row a chart operation works on this round (null after LW203). */
function chartRow(m: Machine, op: Extract<Op, { type: 'chart' }>, report: boolean): ChartRow | null {
  const chart = m.charts.get(op.chart.name);
  if (!chart) {
    if (report && !m.ctx.reporter.repeat('LW203', op.chart.span, undefined, '')) {
      m.ctx.reporter.report('LW203', op.chart.span, { name: op.chart.name, suggest: closestName(op.chart.name, m.charts.keys()) ?? '' });
    }
    return null;
  }
  if (chart.rows.length === 0) return null;
  const h = chart.rows.length;
  const n = op.row ? m.ctx.graded(op.row) : ((m.roundNo - m.lineFirst) % h) + 1;
  if (n < 1 || n > h) {
    if (report) m.ctx.report('LW210', op.row?.span ?? op.span, { detail: `chart ${chart.name} has rows 1 to ${h}, not ${n}` });
    return null;
  }
  return chart.rows[n - 1];
}

/** Works a chart row once: right to left on RS rows, left to right on WS rows. */
function workChartRow(m: Machine, row: ChartRow, yarn: number): void {
  const ws = m.side === 'WS';
  const n = row.consumes;
  // Fast path: plain cells over plain front stitches, no marker, ladder or held column in the way.
  if (row.simple && !m.hasBacking && m.ladder === null && m.pendingClose < 0 && m.end - m.pos >= n && m.nextEvent >= m.pos + n) {
    const cells = ws ? row.ws : row.rs;
    const s = m.store;
    if (s.length + n > s.op.length) s.reserve(n);
    let k = s.length;
    for (let j = 0; j < n; j++, k++) {
      const y = cells.yarn[j];
      s.op[k] = cells.op[j]; s.yarn[k] = y >= 0 ? y : yarn; s.flags[k] = FLAG.CHART; s.src[k] = row.src; s.col[k] = -1;
    }
    s.length = k;
    m.pos += n; m.front += n; m.worked += n;
    return;
  }
  const cells = row.cells;
  for (let k = 0; k < cells.length; k++) {
    const cell = cells[ws ? k : cells.length - 1 - k];
    if (cell.none) continue;
    workStitch(m, ws ? cell.ws : cell.rs, cell.yarn >= 0 ? cell.yarn : yarn, row.src, FLAG.CHART);
  }
}

/** What a repeat pass that took and gave no stitch counted, and the machine's shape after it. */
interface IdlePass { worked: number; missing: number; after: number[] }

/**
 * Everything besides the counts that a pass which takes and gives no stitch
 * could still change: markers, segment and event cursors, catches, a held
 * backing stitch, the problem flag.
 */
function machineShape(m: Machine): number[] {
  return [m.mi, m.si, m.markersIn.length, m.markersOut.length, m.catchYarn.length, m.pendingClose, m.problem ? 1 : 0, m.nextEvent];
}

function sameShape(a: number[], b: number[]): boolean {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/**
 * Counts `k` more idle passes like `pass` as the loop would have: each adds
 * its counts and one step; past the step bound the pass that crosses it
 * still counts, then LW901 (Machine.step) ends the size.
 */
function skipIdlePasses(m: Machine, k: number, pass: IdlePass, span: Span): void {
  if (k <= 0) return;
  const room = Math.max(0, LIMITS.steps - m.steps);
  const done = Math.min(k, room + 1);
  m.worked += done * pass.worked;
  m.missing += done * pass.missing;
  if (done <= room) { m.steps += done; return; }
  m.steps = LIMITS.steps + done - room - 1;
  m.step(span);
}

/** Works an operation list over the current scope. */
export function execOps(m: Machine, ops: readonly Op[], yarn: number): void {
  for (let i = 0; i < ops.length; i++) {
    if (m.aborted) return;
    if (!m.operate(ops[i].span)) return;
    if (m.pos >= m.nextEvent) m.passEvents();
    execOp(m, ops[i], yarn);
  }
}

function execOp(m: Machine, op: Op, yarn: number): void {
  const src = m.sources.of(op);
  switch (op.type) {
    case 'stitch': {
      const y = m.ctx.yarn(op.yarn, yarn);
      const info = op.stitch;
      let reps = op.count ? m.ctx.graded(op.count) : 1;
      if (op.to) {
        if (info.consumes === 0) {
          m.ctx.report('LW306', op.span, {});
          m.problem = true;
          return;
        }
        const n = available(m, op.to, op.span);
        if (n < 0) { m.problem = true; return; }
        reps = Math.floor(n / info.consumes);
        const over = n % info.consumes;
        if (over) {
          reportRound(m, 'LW302', op.span, { repeat: info.consumes, available: n, over });
          m.problem = true;
        }
      }
      if (reps < 0) return;
      if (!m.room(reps * info.produces, op.span)) return;
      for (let r = 0; r < reps; r++) {
        if (workStitch(m, info, y, src, 0) === 0 && info.consumes > 0) {
          // The needle is empty here, so every remaining working would find
          // nothing too: count them at once instead of looping (a huge count
          // such as `bo 4294967297` must not hang the compiler).
          const rest = reps - r - 1;
          m.worked += rest * info.consumes;
          m.missing += rest * info.consumes;
          break;
        }
      }
      return;
    }
    case 'group': {
      const y = m.ctx.yarn(op.yarn, yarn);
      let reps = 1;
      if (op.repeat.kind === 'times') reps = m.ctx.graded(op.repeat.n);
      else if (op.repeat.kind !== 'once') {
        const per = consumption(m, op.ops);
        if (per === null) reps = 1;
        else if (per === 0) { m.ctx.report('LW306', op.span, {}); m.problem = true; return; }
        else {
          const n = available(m, op.repeat, op.span);
          if (n < 0) { m.problem = true; return; }
          reps = Math.floor(n / per);
          const over = n % per;
          if (over) {
            reportRound(m, 'LW302', op.span, { repeat: per, available: n, over });
            m.problem = true;
          }
        }
      }
      let idle: IdlePass | null = null; // the previous pass, when it took and gave nothing
      for (let r = 0; r < reps; r++) {
        const pos = m.pos, out = m.store.length, worked = m.worked, missing = m.missing;
        execOps(m, op.ops, y);
        // Only passes that take and give nothing count against the step bound (they cannot run away otherwise).
        if (m.pos === pos && m.store.length === out) {
          if (!m.step(op.span)) return;
          const pass: IdlePass = { worked: m.worked - worked, missing: m.missing - missing, after: machineShape(m) };
          if (idle && pass.worked === idle.worked && pass.missing === idle.missing && sameShape(idle.after, pass.after)) {
            // This pass started where the one before ended, left the machine as it found it
            // but for the counts, and counted what that one counted: every pass still to come
            // is the same. Count them at once instead of looping (`(k1, close) 999999 times`
            // on a used-up needle must not spin).
            skipIdlePasses(m, reps - r - 1, pass, op.span);
            return;
          }
          idle = pass;
        } else idle = null;
        if (m.aborted) return;
      }
      return;
    }
    case 'chart': {
      const row = chartRow(m, op, true);
      if (!row) { m.problem = true; return; }
      if (row.consumes === 0) return;
      const n = m.fronts(m.pos, m.end);
      const chart = m.charts.get(op.chart.name)!;
      const rowNo = chart.rows.indexOf(row) + 1;
      if (n < row.consumes) {
        reportRound(m, 'LW304', op.span, { chart: chart.name, row: rowNo, width: row.consumes, available: n });
        m.problem = true;
        workChartRow(m, row, yarn);
        return;
      }
      let reps = 1;
      if (!op.once) {
        reps = Math.floor(n / row.consumes);
        const over = n % row.consumes;
        if (over) {
          reportRound(m, 'LW302', op.span, { repeat: row.consumes, available: n, over });
          m.problem = true;
        }
      }
      if (!m.room(reps * row.produces, op.span)) return;
      for (let r = 0; r < reps; r++) workChartRow(m, row, yarn);
      return;
    }
    case 'mark': {
      if (m.markersOut.some((x) => x.name === op.name.name) || m.markersIn.slice(m.mi).some((x) => x.name === op.name.name)) {
        m.ctx.report('LW206', op.name.span, { what: 'marker', name: op.name.name });
        return;
      }
      m.markersOut.push({ name: op.name.name, at: m.store.length - m.outStart });
      return;
    }
    case 'unmark': {
      const here = m.store.length - m.outStart;
      const k = m.markersOut.findIndex((x) => x.name === op.name.name && x.at === here);
      if (k >= 0) { m.markersOut.splice(k, 1); return; }
      const j = m.markersIn.findIndex((x, idx) => idx >= m.mi && x.name === op.name.name && x.at === m.pos);
      if (j >= 0) { m.markersIn.splice(j, 1); m.passEvents(); return; }
      if (m.markersIn.some((x) => x.name === op.name.name)) {
        reportRound(m, 'LW307', op.span, { detail: `marker ${op.name.name} is not at this point of the ${m.word}` });
      } else if (!m.ctx.repeat('LW205', op.name.span)) {
        const known = [...new Set([...m.markersIn.map((x) => x.name), ...m.markersOut.map((x) => x.name)])].join(', ');
        m.ctx.report('LW205', op.name.span, { round: m.roundNo, name: op.name.name, known });
      }
      return;
    }
    case 'catch': {
      const y = m.ctx.yarn(op.yarn, yarn);
      const k = m.catchAt.length - 1;
      // A second catch of the same yarn at the same place changes nothing.
      if (k < 0 || m.catchAt[k] !== m.front || m.catchYarn[k] !== y) { m.catchYarn.push(y); m.catchAt.push(m.front); }
      return;
    }
    case 'raise':
      if (!m.room(1, op.span)) return;
      m.raise(m.ctx.yarn(op.yarn, yarn), src, 0);
      return;
    case 'carry': {
      const n = op.count ? m.ctx.graded(op.count) : 1;
      for (let r = 0; r < n; r++) {
        if (m.pos >= m.end) { m.worked += n - r; m.missing += n - r; break; }
        if (m.pos >= m.nextEvent) m.passEvents();
        const f = m.inFlags[m.pos];
        if (f & FLAG.BACKING) {
          m.worked++;
          m.putBacking(OP.carry, m.inYarn[m.pos], src, f, m.inCol[m.pos]);
          m.pos++;
        } else {
          reportRound(m, 'LW405', op.span, { detail: 'carry meets a front stitch, not a backing stitch; it is knitted' });
          workStitch(m, STITCHES[OP.k], yarn, src, 0);
        }
      }
      return;
    }
    case 'close': closeBacking(m, op.how, yarn, src, op.span); return;
    case 'cable': {
      const y = m.ctx.yarn(op.yarn, yarn);
      const code = op.dir === 'left' ? OP.cableLeft : OP.cableRight;
      const n = op.held + op.worked;
      if (!m.room(n, op.span)) return;
      let got = 0;
      // Once the scope is used up every further take finds nothing too: stop there
      // (a cable of a million stitches must not ask a million times).
      for (let j = 0; j < n; j++) { if (m.takeFront(src, 'the cable') < 0) break; got++; }
      m.worked += n;
      if (got < n) {
        m.missing += n - got;
        reportRound(m, 'LW303', op.span, { stitch: `cable ${op.held} over ${op.worked}`, needs: n, left: got });
        m.problem = true;
      }
      for (let j = 0; j < got; j++) m.putFront(code, y, src, 0);
      return;
    }
  }
}

/** close / close ssk: a backing stitch and its front neighbour worked together into one front stitch. */
function closeBacking(m: Machine, how: 'k2tog' | 'ssk', yarn: number, src: number, span: Span): void {
  if (m.pos >= m.nextEvent) m.passEvents();
  const a = m.pos, b = m.pos + 1;
  m.worked += 2;
  if (a >= m.end) {
    m.missing += 2;
    reportRound(m, 'LW405', span, { detail: 'there is no stitch left to close' });
    m.problem = true;
    return;
  }
  const fa = m.inFlags[a];
  const fb = b < m.end ? m.inFlags[b] : -1;
  const backA = (fa & FLAG.BACKING) !== 0, backB = fb >= 0 && (fb & FLAG.BACKING) !== 0;
  if (fb < 0) {
    m.missing += 1;
    m.problem = true;
    if (backA) {
      m.noteReportedColumn(m.inCol[a]);
      reportRound(m, 'LW403', span, { detail: 'the backing stitch is the last stitch here, with no front neighbour to close with' });
      m.putBacking(OP.carry, m.inYarn[a], src, fa, m.inCol[a]);
    } else {
      reportRound(m, 'LW405', span, { detail: 'there is no backing stitch here to close' });
      m.putFront(OP.k, m.inYarn[a], src, 0);
    }
    m.pos = a + 1;
    return;
  }
  m.pos = b + 1;
  if (backA && backB) {
    m.noteReportedColumn(m.inCol[a]);
    m.noteReportedColumn(m.inCol[b]);
    reportRound(m, 'LW403', span, { detail: 'two backing stitches side by side: close needs a front stitch as neighbour' });
    m.putBacking(OP.carry, m.inYarn[a], src, fa, m.inCol[a]);
    m.putBacking(OP.carry, m.inYarn[b], src, fb, m.inCol[b]);
    m.problem = true;
    return;
  }
  const key = `${m.side}:${m.front}`;
  if (!backA && !backB) {
    const before = m.closed.get(key);
    if (m.merged.has(key)) {
      // Already reported: the backing stitch here was knitted into the fabric (LW401).
    } else if (before) {
      reportRound(m, 'LW402', span, { closedIn: before.round }, '', [{ span: before.span, message: `closed here in ${m.word} ${before.round}` }]);
    } else {
      reportRound(m, 'LW405', span, { detail: 'there is no backing stitch here to close; the two stitches are worked together as a decrease' });
    }
    m.putFront(how === 'ssk' ? OP.closeSsk : OP.closeK2tog, yarn, src, 0);
    return;
  }
  m.noteClosed(key, { round: m.roundNo, span });
  m.putFront(how === 'ssk' ? OP.closeSsk : OP.closeK2tog, yarn, src, 0);
}
