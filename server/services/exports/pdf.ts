/**
 * The PDF export with pdfkit and the shipped Inter fonts (WOFF; pdfkit
 * cannot read WOFF2): a first page with the facts, yarns and amounts,
 * abbreviations and cautions; the chart drawn as vectors from the shared
 * SVG (svg-to-pdfkit), scaled to the page; then the written instructions,
 * where an entry that would not fit on the rest of a page starts the next
 * one, so a round's entry never splits across pages. Every page carries a
 * footer "title, version, page N of M".
 */
import PDFDocument from 'pdfkit';
import SVGtoPDF from 'svg-to-pdfkit';
import type { ExportDocument } from './document.ts';
import { woffPath } from './fonts.ts';

/** Called with 0..1 as the document grows. */
export type ProgressFn = (fraction: number) => void;

const MARGIN = 50;
const FOOTER = 28;
const INK = '#1f1d1b';
const MUTED = '#5b5650';

/** Smallest chart scale: the shared chart draws 16-unit cells, so 0.5 keeps a cell at 8 pt (about 2.8 mm). */
export const MIN_CHART_SCALE = 0.5;
const A4 = { width: 595.28, height: 841.89 };
/** Room for the chart on a page: the margins, the footer and the heading line. */
const CHART_HEADING = 26;

/** How a chart of `w` x `h` SVG units goes on pages: one scale and orientation, and the top-left corner (SVG units) of each page's part. */
export interface ChartPlan { layout: 'portrait' | 'landscape'; scale: number; tiles: { x: number; y: number }[] }

/**
 * Plans the chart pages: the whole chart on one page when it fits at
 * {@link MIN_CHART_SCALE} or larger (never enlarged past 1), else parts of
 * it at that scale on as few pages as possible, preferring to keep whole
 * rounds on a page. Parts run from the chart's right edge (where rounds
 * start) and from the bottom (round 1).
 */
export function planChartPages(w: number, h: number): ChartPlan {
  const options = (['portrait', 'landscape'] as const).map((layout) => {
    const pageW = (layout === 'portrait' ? A4.width : A4.height) - 2 * MARGIN;
    const room = (layout === 'portrait' ? A4.height : A4.width) - 2 * MARGIN - FOOTER - CHART_HEADING;
    const fit = Math.min(1, pageW / w, room / h);
    const scale = fit >= MIN_CHART_SCALE ? fit : MIN_CHART_SCALE;
    const tileW = pageW / scale, tileH = room / scale;
    const cols = Math.max(1, Math.ceil(w / tileW - 1e-6)), rows = Math.max(1, Math.ceil(h / tileH - 1e-6));
    const tiles: { x: number; y: number }[] = [];
    for (let r = 0; r < rows; r++) {
      for (let c = 0; c < cols; c++) tiles.push({ x: Math.max(0, w - (c + 1) * tileW), y: Math.max(0, h - (r + 1) * tileH) });
    }
    return { layout, scale, tiles, cols };
  });
  options.sort((a, b) => a.tiles.length - b.tiles.length || a.cols - b.cols || b.scale - a.scale);
  const best = options[0]!;
  return { layout: best.layout, scale: best.scale, tiles: best.tiles };
}

/**
 * Draws `svg` (w x h units, at the origin) into a new form XObject instead
 * of the page: the page's content writer is swapped for the form's while
 * svg-to-pdfkit draws, and the form shares the page's resources (fonts,
 * graphics states) it registered. Drawing a big chart takes seconds, so a
 * chart on several pages is drawn once.
 */
function drawOnce(pdf: PDFKit.PDFDocument, svg: string, w: number, h: number): PDFKit.PDFKitReference {
  const page = pdf.page as unknown as { write(chunk: unknown): unknown; resources: PDFKit.PDFKitReference };
  const recorded: unknown[] = [];
  page.write = (chunk: unknown) => recorded.push(chunk);
  try {
    pdf.save();
    SVGtoPDF(pdf, svg, 0, 0, { width: w, height: h, preserveAspectRatio: 'xMinYMin meet', fontCallback: (_family: string, bold: boolean) => (bold ? 'Inter-Bold' : 'Inter') });
    pdf.restore();
  } finally {
    delete (page as { write?: unknown }).write; // back to the prototype's writer
  }
  const form = pdf.ref({ Type: 'XObject', Subtype: 'Form', FormType: 1, BBox: [0, 0, w, h], Resources: page.resources });
  const sink = form as unknown as { write(c: unknown): void; end(): void };
  for (const chunk of recorded) sink.write(chunk);
  sink.end();
  return form;
}

/** Writes `doc` as a PDF (A4). */
export async function writePdf(doc: ExportDocument, onProgress: ProgressFn = () => {}): Promise<Buffer> {
  const pdf = new PDFDocument({
    size: 'A4',
    margins: { top: MARGIN, bottom: MARGIN, left: MARGIN, right: MARGIN },
    bufferPages: true,
    info: { Title: `${doc.title}: ${doc.subtitle}`, Author: doc.designer ?? 'Loopwright', Creator: 'Loopwright' },
  });
  const chunks: Buffer[] = [];
  pdf.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    pdf.on('end', () => resolve(Buffer.concat(chunks)));
    pdf.on('error', reject);
  });
  pdf.registerFont('Inter', woffPath('regular'));
  pdf.registerFont('Inter-Bold', woffPath('bold'));
  pdf.font('Inter').fillColor(INK);

  const width = pdf.page.width - 2 * MARGIN;
  const bottom = () => pdf.page.height - MARGIN - FOOTER;
  const heading = (text: string, size = 13) => {
    if (pdf.y + 40 > bottom()) pdf.addPage();
    pdf.moveDown(0.6).font('Inter-Bold').fontSize(size).fillColor(INK).text(text, MARGIN, pdf.y, { width });
    pdf.moveDown(0.25).font('Inter').fontSize(10);
  };
  /** A paragraph that never splits: it moves whole to the next page when it would not fit. */
  const block = (draw: () => void, height: number) => {
    if (pdf.y + height > bottom()) pdf.addPage();
    draw();
  };
  const para = (text: string, opts: { size?: number; color?: string; indent?: number } = {}) => {
    const size = opts.size ?? 10;
    const indent = opts.indent ?? 0;
    pdf.font('Inter').fontSize(size);
    const h = pdf.heightOfString(text, { width: width - indent });
    block(() => pdf.fillColor(opts.color ?? INK).text(text, MARGIN + indent, pdf.y, { width: width - indent }), h);
  };

  // Page 1: the facts.
  pdf.font('Inter-Bold').fontSize(22).text(doc.title, { width });
  pdf.font('Inter').fontSize(12).fillColor(MUTED).text(doc.subtitle, { width });
  if (doc.designer) pdf.text(`Designer: ${doc.designer}`, { width });
  pdf.fillColor(INK);
  heading('Pattern facts');
  para(`Sizes: ${doc.sizes.join(', ')} (this copy: ${doc.size})`);
  para(`Gauge: ${doc.gauge ?? 'not declared'}`);
  if (doc.yarnWeight) para(`Yarn weight: ${doc.yarnWeight}`);
  for (const f of doc.finished) para(f);

  heading('Yarns and amounts');
  for (const y of doc.yarns) {
    const text = `${y.name}: ${y.label} (${y.colour})${y.amount ? `, ${y.amount}` : ''}`;
    pdf.font('Inter').fontSize(10);
    const h = Math.max(14, pdf.heightOfString(text, { width: width - 22 }));
    block(() => {
      const top = pdf.y;
      pdf.save().rect(MARGIN, top + 1, 12, 12).fillAndStroke(/^#[0-9a-f]{6}$/i.test(y.colour) ? y.colour : '#ffffff', '#777777').restore();
      pdf.fillColor(INK).text(text, MARGIN + 22, top, { width: width - 22 });
      pdf.y = Math.max(pdf.y, top + h) + 2;
    }, h + 2);
  }
  if (doc.yarnAssumption) para(`Amounts are estimates, not measurements. ${doc.yarnAssumption}`, { size: 9, color: MUTED });

  heading('Abbreviations');
  for (const k of doc.key) para(`${k.abbreviation}: ${k.meaning}`);

  heading('Cautions');
  for (const c of doc.cautions) para(`• ${c}`, { size: 9.5 });
  if (doc.problems.length) {
    heading('Open problems in this revision');
    for (const p of doc.problems) para(p, { size: 9, color: '#9b2c1f' });
  }
  onProgress(0.3);

  // The chart, vector, on as few pages as keep cells legible (see planChartPages).
  if (doc.chartSvg) {
    const m = /<svg[^>]*\bwidth="([\d.]+)"[^>]*\bheight="([\d.]+)"/.exec(doc.chartSvg);
    const w = Number(m?.[1] ?? width), h = Number(m?.[2] ?? width);
    const plan = planChartPages(w, h);
    let form: PDFKit.PDFKitReference | null = null;
    plan.tiles.forEach((tile, i) => {
      pdf.addPage({ size: 'A4', layout: plan.layout, margins: { top: MARGIN, bottom: MARGIN, left: MARGIN, right: MARGIN } });
      const pageWidth = pdf.page.width - 2 * MARGIN;
      const part = plan.tiles.length > 1 ? `, part ${i + 1} of ${plan.tiles.length} (columns from the right edge, ${doc.construction === 'flat' ? 'rows' : 'rounds'} from the bottom)` : '';
      pdf.font('Inter-Bold').fontSize(13).fillColor(INK).text(`Chart${part}`, MARGIN, MARGIN, { width: pageWidth });
      const top = pdf.y + 6;
      const room = bottom() - top;
      // The chart is drawn once into a form XObject and placed on every page of the plan.
      form ??= drawOnce(pdf, doc.chartSvg as string, w, h);
      pdf.page.xobjects.LwChart = form;
      pdf.save();
      pdf.rect(MARGIN, top, pageWidth, room).clip();
      pdf.transform(plan.scale, 0, 0, plan.scale, MARGIN - tile.x * plan.scale, top - tile.y * plan.scale);
      pdf.addContent('/LwChart Do');
      pdf.restore();
      onProgress(0.3 + 0.2 * ((i + 1) / plan.tiles.length));
    });
    pdf.addPage({ size: 'A4', layout: 'portrait', margins: { top: MARGIN, bottom: MARGIN, left: MARGIN, right: MARGIN } });
  } else pdf.addPage();
  onProgress(0.5);

  // Written instructions: one entry never splits across pages.
  pdf.font('Inter-Bold').fontSize(13).fillColor(INK).text('Written instructions', { width });
  pdf.moveDown(0.4);
  para(doc.castOn);
  pdf.moveDown(0.3);
  const labelWidth = 78;
  doc.entries.forEach((e, i) => {
    const body = `${e.text}${e.counts ? ` (${e.counts})` : ''}`;
    pdf.font('Inter').fontSize(10);
    let h = pdf.heightOfString(body, { width: width - labelWidth });
    if (e.note) h += pdf.fontSize(9).heightOfString(`Note: ${e.note}`, { width: width - labelWidth });
    pdf.font('Inter-Bold').fontSize(10);
    h = Math.max(h, pdf.heightOfString(e.label, { width: labelWidth - 6 })) + 4;
    block(() => {
      const top = pdf.y;
      pdf.font('Inter-Bold').fontSize(10).fillColor(INK).text(e.label, MARGIN, top, { width: labelWidth - 6 });
      // Counts in bold, so the number to check after the round stands out.
      pdf.font('Inter').fontSize(10).text(e.text, MARGIN + labelWidth, top, { width: width - labelWidth, continued: Boolean(e.counts) });
      if (e.counts) pdf.font('Inter-Bold').text(` (${e.counts})`, { continued: false });
      if (e.note) pdf.fontSize(9).fillColor(MUTED).text(`Note: ${e.note}`, MARGIN + labelWidth, pdf.y, { width: width - labelWidth });
      pdf.y = Math.max(pdf.y, top + h);
    }, h);
    if (i % 25 === 0) onProgress(0.5 + 0.4 * (i / Math.max(1, doc.entries.length)));
  });

  // Footers on every page (buffered pages, so the total is known).
  const range = pdf.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    pdf.switchToPage(i);
    // Writing inside the bottom margin would add a page; lift the margin while the footer is written.
    const saved = pdf.page.margins.bottom;
    pdf.page.margins.bottom = 0;
    pdf.font('Inter').fontSize(8).fillColor(MUTED)
      .text(`${doc.title}, ${doc.subtitle}. Page ${i + 1} of ${range.count}`, MARGIN, pdf.page.height - MARGIN + 6, { width: pdf.page.width - 2 * MARGIN, align: 'center', lineBreak: false });
    pdf.page.margins.bottom = saved;
  }
  onProgress(0.95);
  pdf.end();
  return done;
}
