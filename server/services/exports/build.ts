/**
 * Runs one export: the export document, then the bytes in the asked format
 * (PDF, plain text, chart SVG, chart PNG). Used by the export worker thread;
 * callable directly as well. Reports progress 0..1.
 */
import { Resvg } from '@resvg/resvg-js';
import { buildExportDocument, ExportRefusal, formatExportText, type ExportInput } from './document.ts';
import { sfntFontFiles } from './fonts.ts';
import { writePdf, type ProgressFn } from './pdf.ts';

/** Export formats (same as EXPORT_FORMATS in shared/api-schemas.ts). */
export type ExportFormat = 'pdf' | 'txt' | 'svg' | 'png';

/** The finished file. */
export interface ExportFile { bytes: Buffer; contentType: string; filename: string }

const CONTENT_TYPES: Record<ExportFormat, string> = {
  pdf: 'application/pdf',
  txt: 'text/plain; charset=utf-8',
  svg: 'image/svg+xml',
  png: 'image/png',
};

/** PNG scale: 2 device pixels per SVG unit, so chart symbols stay sharp when printed. */
export const PNG_ZOOM = 2;

/** A file name from the title, version and size: letters, digits and dashes only. */
export function exportFilename(input: ExportInput, size: string, format: ExportFormat): string {
  const slug = (s: string) => s.normalize('NFKD').replace(/[^\w.]+/g, '-').replace(/^-+|-+$/g, '').toLowerCase() || 'pattern';
  const version = input.label ? `v${input.label}` : `r${input.revision}`;
  const view = (format === 'svg' || format === 'png') ? `-chart${input.view === 'back' ? '-back' : ''}` : '';
  return `${slug(input.title)}-${version}-${slug(size)}${view}.${format}`;
}

/** Rasterises an SVG with the shipped fonts only (no system fonts). */
export function rasterise(svg: string, zoom = PNG_ZOOM): Buffer {
  const resvg = new Resvg(svg, {
    font: { loadSystemFonts: false, fontFiles: sfntFontFiles(), defaultFontFamily: 'Inter' },
    fitTo: { mode: 'zoom', value: zoom },
    background: '#ffffff',
  });
  return Buffer.from(resvg.render().asPng());
}

/** Builds one export; throws ExportRefusal for user matters (unknown size, no chart). */
export async function runExport(input: ExportInput, format: ExportFormat, onProgress: ProgressFn = () => {}): Promise<ExportFile> {
  const doc = buildExportDocument(input);
  onProgress(0.2);
  const filename = exportFilename(input, doc.size, format);
  const file = (bytes: Buffer): ExportFile => ({ bytes, contentType: CONTENT_TYPES[format], filename });
  switch (format) {
    case 'txt':
      return file(Buffer.from(formatExportText(doc), 'utf8'));
    case 'svg':
    case 'png': {
      if (!doc.chartSvg) throw new ExportRefusal('no-chart', `Size ${doc.size} has no chart to export yet.`);
      if (format === 'svg') return file(Buffer.from(doc.chartSvg, 'utf8'));
      onProgress(0.4);
      return file(rasterise(doc.chartSvg));
    }
    case 'pdf':
      return file(await writePdf(doc, (f) => onProgress(0.2 + 0.8 * f)));
  }
}
