/**
 * The printable walkthrough report: a PDF that parses (header, trailer, pages), carries the
 * report's content as text, embeds the JPEG/PNG photos and lists the others, and numbers its pages.
 * Streams are written uncompressed (the `compress: false` option) so the text can be read back.
 */
import { describe, expect, it } from 'vitest';
import { renderWalkthroughPdf } from '../../../src/server/reports/pdf';
import { extractText, imageCount, pageCount } from './pdf-text';
import { gradientPng } from './png';
import { fullReport, minimalReport } from './report-fixture';

const png = gradientPng(32, 24);

async function render(report = fullReport(), opts: Parameters<typeof renderWalkthroughPdf>[1] = {}) {
  const bytes = await renderWalkthroughPdf(report, { compress: false, photo: () => png, ...opts });
  const pdf = bytes.toString('latin1');
  const lines = extractText(pdf);
  // Wrapped lines keep their trailing space or hyphen, so joining them gives the running text back.
  return { bytes, pdf, lines, text: lines.split('\n').join('') };
}

describe('the walkthrough PDF', () => {
  it('is a PDF file: header, cross-reference trailer, and as many pages as its footers say', async () => {
    const { pdf, lines } = await render();
    // Source: ISO 32000-1 §7.5.2 (header "%PDF-1.n") and §7.5.5 (file ends with %%EOF).
    expect(pdf.startsWith('%PDF-1.')).toBe(true);
    expect(pdf.trimEnd().endsWith('%%EOF')).toBe(true);
    const pages = pageCount(pdf);
    expect(pages).toBeGreaterThanOrEqual(3);
    const footers = [...lines.matchAll(/Page (\d+) of (\d+)/g)];
    expect(footers.map((m) => Number(m[1]))).toEqual(Array.from({ length: pages }, (_, i) => i + 1));
    expect(new Set(footers.map((m) => Number(m[2])))).toEqual(new Set([pages]));
  });

  it('shows the building, the audit, the benchmark and the baselines', async () => {
    const { text } = await render();
    for (const s of ['Building 4711 · Test Operations Center', 'Base-load walkthrough', 'Ada Example', 'ASHRAE Standard 211 Level 1', '52,000 ft²', '117.7 kBtu/ft²·yr', '53.5 kBtu/ft²·yr', '2.20 × the peer median', 'heating-cooling (4-parameter)', '4.5 %']) {
      expect(text, s).toContain(s);
    }
  });

  it('lists findings and measures with their economics and the discount rate used', async () => {
    const { text, lines } = await render();
    for (const s of ['Corridor lighting on 24/7', 'Measure: LED retrofit with occupancy sensors', 'Replace boiler with condensing boiler', 'Tune oil burner', 'dismissed', 'rejected', '$14,000', 'real discount rate of 3.0 %', 'in force from 1 Apr 2010']) {
      expect(text, s).toContain(s);
    }
    // Payback of the LED measure, (14,000 − 2,000) / (2,236 + 150) = 5.03 yr (10 CFR 436.23), printed to 0.1.
    expect(lines).toMatch(/\n5\.0\n/);
  });

  it('totals the measures that are not rejected in the roll-up', async () => {
    const { text } = await render();
    // Installed cost 14,000 + 95,000 + 600 + 800 = $110,400 (constructed figures; the rejected one costs 0).
    expect(text).toContain('$110,400 less $2,000 incentives');
    expect(text).toContain('4 (proposed 2, approved 1, implemented 1; 1 rejected not counted)');
  });

  it('prints the form sections as tables, with the flow test in gpm', async () => {
    const { text } = await render();
    for (const s of ['Lighting inventory', 'Open office, 2nd floor', 'Linear fluorescent T12', 'HVAC and nameplates', 'Invented Works / HB-400 / SN-0001', 'Desktop computers', 'Water fixtures', 'No night setback', 'Server room door propped open.', 'No envelope items recorded.']) {
      expect(text, s).toContain(s);
    }
    // Bag test 0.5 gal in 12 s = 0.5 × 60 / 12 = 2.5 gpm (EPA WaterSense bag-test method: gallons per minute).
    expect(text).toContain('2.50');
  });

  it('embeds a PNG photo and lists the photo it cannot embed, then the safety note', async () => {
    const { pdf, text } = await render();
    expect(imageCount(pdf)).toBe(1);
    expect(text).toContain('T12 wraps in corridor');
    expect(text).toContain('image/heic: not embedded');
    expect(text).toContain('NFPA 70E');
    expect(text).toContain('licensed');
  });

  it('lists a photo whose file is missing instead of failing', async () => {
    const { pdf, text } = await render(fullReport(), { photo: () => null });
    expect(imageCount(pdf)).toBe(0);
    expect(text).toContain('file not found');
  });

  it('a minimal report (no findings, empty form, no auditor) still makes a complete document', async () => {
    const { pdf, text } = await render(minimalReport());
    expect(pageCount(pdf)).toBeGreaterThanOrEqual(1);
    for (const s of ['Building 12 · Small Store', 'not assigned', 'No findings were recorded.', 'No measures to total', 'No lighting recorded.', 'No photos were taken.', 'Page 1 of']) {
      expect(text, s).toContain(s);
    }
  });

  it('with the built-in Helvetica, symbols outside its encoding are spelled out, not dropped', async () => {
    const r = fullReport();
    r.findings[0]!.description = 'Measured ≥ 300 lux; CO₂ fine';
    const { text } = await render(r, { builtInFont: true });
    expect(text).toContain('Measured >= 300 lux; CO2 fine');
    expect(text).toContain('52,000 ft²');
  });

  it('compresses its streams by default', async () => {
    const plain = await render();
    const packed = await renderWalkthroughPdf(fullReport(), { photo: () => png });
    expect(packed.toString('latin1')).toContain('/FlateDecode');
    expect(packed.length).toBeLessThan(plain.bytes.length);
  });
});
