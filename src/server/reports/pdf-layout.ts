/**
 * Layout pieces for the printable walkthrough report on pdfkit: fonts (the project's Noto Sans,
 * shipped by @fontsource as WOFF, which pdfkit's font engine reads; Helvetica when it is missing),
 * text made safe for the font, headings, key–value blocks and tables that wrap their cells and
 * continue on the next page with the header repeated.
 */
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { projectRoot } from '../../db/paths';

export type Doc = PDFKit.PDFDocument;

export const PAGE = { margin: 54, footer: 30 } as const;
export const INK = '#1f2a30';
export const MUTED = '#5b6770';
export const RULE = '#c9d1d6';
export const BAND = '#eef2f4';

export interface Fonts {
  regular: string;
  bold: string;
  /** True when the built-in Helvetica (WinAnsi only) is used. */
  builtIn: boolean;
}

/** Registers Noto Sans (regular and bold) from @fontsource when installed, else uses Helvetica. */
export function registerFonts(doc: Doc, builtIn = false): Fonts {
  const dir = join(projectRoot(), 'node_modules', '@fontsource', 'noto-sans', 'files');
  const regular = join(dir, 'noto-sans-latin-400-normal.woff');
  const bold = join(dir, 'noto-sans-latin-700-normal.woff');
  if (!builtIn && existsSync(regular) && existsSync(bold)) {
    doc.registerFont('Body', regular);
    doc.registerFont('Body-Bold', bold);
    return { regular: 'Body', bold: 'Body-Bold', builtIn: false };
  }
  return { regular: 'Helvetica', bold: 'Helvetica-Bold', builtIn: true };
}

// Characters outside both fonts' Latin subsets, written the way a typewriter would.
const REPLACEMENTS: Record<string, string> = { '≥': '>=', '≤': '<=', '₂': '2', '→': '->', '←': '<-', '≈': '~', '✓': 'yes', '−': '-', '\u00a0': ' ' };
// WinAnsi (PDF 32000-1 Annex D) beyond Latin-1: the characters Helvetica can also show.
const WIN_ANSI_EXTRA = new Set('€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ');

/** Text the chosen font can show: known symbols spelled out, control characters dropped. */
export function pdfText(text: string, fonts: Fonts): string {
  // eslint-disable-next-line no-control-regex
  let out = text.replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/g, '');
  out = out.replace(/[≥≤₂→←≈✓−\u00a0]/g, (c) => REPLACEMENTS[c] ?? c);
  if (fonts.builtIn) out = [...out].map((c) => (c.codePointAt(0)! <= 0xff || WIN_ANSI_EXTRA.has(c) ? c : '?')).join('');
  return out;
}

/** Starts a new page when fewer than `needed` points remain above the footer. */
export function ensureSpace(doc: Doc, needed: number): void {
  if (doc.y + needed > doc.page.height - PAGE.margin - PAGE.footer) doc.addPage();
}

export function heading(doc: Doc, fonts: Fonts, text: string, level: 1 | 2 = 1): void {
  ensureSpace(doc, level === 1 ? 60 : 40);
  doc.moveDown(level === 1 ? 0.8 : 0.5);
  doc.font(fonts.bold).fontSize(level === 1 ? 14 : 11).fillColor(INK).text(pdfText(text, fonts), PAGE.margin, doc.y);
  if (level === 1) {
    const y = doc.y + 2;
    doc.moveTo(PAGE.margin, y).lineTo(doc.page.width - PAGE.margin, y).lineWidth(0.75).strokeColor(RULE).stroke();
    doc.y = y + 6;
  } else doc.moveDown(0.2);
}

export function paragraph(doc: Doc, fonts: Fonts, text: string, opts: { size?: number; color?: string; bold?: boolean } = {}): void {
  doc.font(opts.bold ? fonts.bold : fonts.regular).fontSize(opts.size ?? 9.5).fillColor(opts.color ?? INK);
  const t = pdfText(text, fonts);
  ensureSpace(doc, Math.min(doc.heightOfString(t, { width: contentWidth(doc) }), 200));
  doc.text(t, PAGE.margin, doc.y, { width: contentWidth(doc) });
}

export function contentWidth(doc: Doc): number {
  return doc.page.width - 2 * PAGE.margin;
}

/** Label–value pairs in two columns of pairs. Empty values are shown as a dash. */
export function keyValues(doc: Doc, fonts: Fonts, pairs: readonly (readonly [string, string])[]): void {
  const rows: string[][] = [];
  for (let i = 0; i < pairs.length; i += 2) {
    const a = pairs[i]!;
    const b = pairs[i + 1];
    rows.push([a[0], a[1] || '—', b?.[0] ?? '', b ? b[1] || '—' : '']);
  }
  const w = contentWidth(doc);
  table(doc, fonts, [{ header: '', width: w * 0.2, bold: true }, { header: '', width: w * 0.3 }, { header: '', width: w * 0.2, bold: true }, { header: '', width: w * 0.3 }], rows, { header: false, size: 9 });
}

export interface Column {
  header: string;
  width: number;
  align?: 'left' | 'right';
  bold?: boolean;
}

/**
 * A table: each row as tall as its tallest wrapped cell; a row that does not fit starts a new page,
 * where the header is drawn again. Alternate rows are banded for reading across.
 */
export function table(doc: Doc, fonts: Fonts, columns: readonly Column[], rows: readonly (readonly string[])[], opts: { header?: boolean; size?: number } = {}): void {
  const size = opts.size ?? 8;
  const pad = 3;
  const x0 = PAGE.margin;
  const drawHeader = () => {
    if (opts.header === false) return;
    doc.font(fonts.bold).fontSize(size);
    const h = Math.max(...columns.map((c) => doc.heightOfString(pdfText(c.header, fonts), { width: c.width - 2 * pad }))) + 2 * pad;
    ensureSpace(doc, h + size * 2);
    const y = doc.y;
    doc.rect(x0, y, columns.reduce((t, c) => t + c.width, 0), h).fill(BAND);
    let x = x0;
    for (const c of columns) {
      doc.fillColor(INK).text(pdfText(c.header, fonts), x + pad, y + pad, { width: c.width - 2 * pad, align: c.align ?? 'left' });
      x += c.width;
    }
    doc.y = y + h;
  };
  drawHeader();
  rows.forEach((row) => {
    const cells = row.map((v) => pdfText(v, fonts));
    const h =
      Math.max(
        ...columns.map((c, i) => {
          doc.font(c.bold ? fonts.bold : fonts.regular).fontSize(size);
          return doc.heightOfString(cells[i] || ' ', { width: c.width - 2 * pad });
        }),
      ) +
      2 * pad;
    if (doc.y + h > doc.page.height - PAGE.margin - PAGE.footer) {
      doc.addPage();
      drawHeader();
    }
    const y = doc.y;
    let x = x0;
    columns.forEach((c, i) => {
      doc.font(c.bold ? fonts.bold : fonts.regular).fontSize(size).fillColor(INK);
      doc.text(cells[i] ?? '', x + pad, y + pad, { width: c.width - 2 * pad, align: c.align ?? 'left' });
      x += c.width;
    });
    doc.moveTo(x0, y + h).lineTo(x, y + h).lineWidth(0.4).strokeColor(RULE).stroke();
    doc.y = y + h;
  });
  doc.x = x0;
  doc.moveDown(0.4);
}

/** Column widths from relative weights over the content width. */
export function widths(doc: Doc, weights: readonly number[]): number[] {
  const total = weights.reduce((t, w) => t + w, 0);
  return weights.map((w) => (contentWidth(doc) * w) / total);
}

/** "Page n of N" on every page, drawn once the document is complete (bufferPages). */
export function pageNumbers(doc: Doc, fonts: Fonts, label: string): void {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const y = doc.page.height - PAGE.margin - 10;
    // Writing below the bottom margin would add a page: lift the margin while drawing the footer.
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc.font(fonts.regular).fontSize(7.5).fillColor(MUTED);
    doc.text(pdfText(label, fonts), PAGE.margin, y, { width: contentWidth(doc) / 2, lineBreak: false });
    doc.text(`Page ${i - range.start + 1} of ${range.count}`, PAGE.margin + contentWidth(doc) / 2, y, { width: contentWidth(doc) / 2, align: 'right', lineBreak: false });
    doc.page.margins.bottom = bottom;
  }
}
