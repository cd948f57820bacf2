/**
 * Just enough of a PDF reader to test pdfkit's uncompressed output (ISO 32000-1): pages are the
 * objects of /Type /Page; text is the hex strings of TJ operators, decoded through each Type0
 * font's ToUnicode CMap (§9.10.3) or, for the standard fonts, as WinAnsiEncoding (Annex D).
 */

// WinAnsiEncoding codes 0x80–0x9F that differ from Latin-1 (ISO 32000-1 Annex D.2), the ones used here.
const WIN_ANSI: Record<number, string> = { 0x80: '€', 0x85: '…', 0x91: '‘', 0x92: '’', 0x93: '“', 0x94: '”', 0x95: '•', 0x96: '–', 0x97: '—' };

function objectBody(pdf: string, id: string): string {
  const start = pdf.indexOf(`\n${id} 0 obj`);
  if (start < 0) return '';
  return pdf.slice(start, pdf.indexOf('endobj', start));
}

function toUnicodeMap(cmap: string): Map<number, string> {
  const map = new Map<number, string>();
  const hex = (h: string) => parseInt(h, 16);
  // A value may hold several UTF-16 units separated by spaces (ligatures: <0066 0069> is "fi").
  const utf16 = (h: string) => String.fromCharCode(...(h.replace(/\s+/g, '').match(/.{4}/g) ?? []).map(hex));
  for (const block of cmap.matchAll(/beginbfrange([\s\S]*?)endbfrange/g)) {
    for (const m of block[1]!.matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]+)>\s*(\[[^\]]*\]|<[0-9a-fA-F]+>)/g)) {
      const lo = hex(m[1]!);
      const hi = hex(m[2]!);
      if (m[3]!.startsWith('[')) [...m[3]!.matchAll(/<([0-9a-fA-F\s]+)>/g)].forEach((u, i) => map.set(lo + i, utf16(u[1]!)));
      else for (let c = lo; c <= hi; c++) map.set(c, String.fromCharCode(hex(m[3]!.slice(1, -1)) + (c - lo)));
    }
  }
  for (const block of cmap.matchAll(/beginbfchar([\s\S]*?)endbfchar/g)) {
    for (const m of block[1]!.matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]+)>/g)) map.set(hex(m[1]!), utf16(m[2]!));
  }
  return map;
}

export function pageCount(pdf: string): number {
  return (pdf.match(/\/Type \/Page(?![a-zA-Z])/g) ?? []).length;
}

export function imageCount(pdf: string): number {
  return (pdf.match(/\/Subtype \/Image/g) ?? []).length;
}

/** The text of every TJ operator, one per line, in content-stream order. */
export function extractText(pdf: string): string {
  const fonts = new Map<string, Map<number, string> | null>();
  for (const m of pdf.matchAll(/\/(F\d+) (\d+) 0 R/g)) {
    if (fonts.has(m[1]!)) continue;
    const cmapRef = objectBody(pdf, m[2]!).match(/\/ToUnicode (\d+) 0 R/);
    fonts.set(m[1]!, cmapRef ? toUnicodeMap(objectBody(pdf, cmapRef[1]!)) : null);
  }
  const lines: string[] = [];
  for (const stream of pdf.matchAll(/stream\n([\s\S]*?)endstream/g)) {
    let font: Map<number, string> | null = null;
    for (const op of stream[1]!.matchAll(/\/(F\d+)\s+[\d.]+\s+Tf|\[([^\]]*)\]\s*TJ/g)) {
      if (op[1]) {
        font = fonts.get(op[1]) ?? null;
        continue;
      }
      let line = '';
      for (const h of op[2]!.matchAll(/<([0-9a-fA-F]*)>/g)) {
        const codes = font ? (h[1]!.match(/.{4}/g) ?? []) : (h[1]!.match(/.{2}/g) ?? []);
        for (const c of codes) {
          const n = parseInt(c, 16);
          line += font ? (font.get(n) ?? '?') : (WIN_ANSI[n] ?? String.fromCharCode(n));
        }
      }
      lines.push(line);
    }
  }
  return lines.join('\n');
}
