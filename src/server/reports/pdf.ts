/**
 * The walkthrough report as a printable PDF (pdfkit, US Letter): title block, building and
 * benchmark summary, baselines, findings and measures with their economics and the discount rate
 * used, the roll-up, the field form as tables, photos (JPEG and PNG embedded, others listed), the
 * safety note, and "Page n of N" on every page.
 *
 * @example
 *   const pdf = await renderWalkthroughPdf(report, { photo: (p) => readPhoto(p.id) });
 */
import { COMMODITY_LABELS, USE_TYPE_LABELS } from '../../lib/domain';
import { SAFETY_DEFERRAL } from '../../lib/field/safety';
import { FINDING_CATEGORY_LABELS, PHOTO_TAG_LABELS } from '../../lib/field/walkthrough-form';
import { formatDate, formatMoney, formatNumber } from '../../lib/format';
import { auditDate, reportMeasures, rollUpMeasures, walkthroughReportSchema, type ReportMeasure, type ReportPhoto, type WalkthroughReport, type WalkthroughReportInput } from '../../lib/reports';
import { formSections } from './pdf-form';
import { contentWidth, ensureSpace, heading, INK, keyValues, MUTED, PAGE, pageNumbers, paragraph, pdfText, registerFonts, table, widths, type Doc, type Fonts } from './pdf-layout';

export interface PdfOptions {
  /** Compress page streams (default true); tests turn it off to read the text. */
  compress?: boolean;
  /** The image bytes of a photo, or null when it cannot be read. */
  photo?: (p: ReportPhoto) => Buffer | null;
  /** Use pdfkit's built-in Helvetica even when Noto Sans is installed. */
  builtInFont?: boolean;
}

const EMBEDDABLE = new Set(['image/jpeg', 'image/png']);

const savingsText = (m: ReportMeasure) => m.savings.map((s) => `${formatNumber(s.quantity, Math.abs(s.quantity) < 100 ? 1 : 0)} ${s.unit} ${COMMODITY_LABELS[s.commodity].toLowerCase()}`).join('\n') || '—';
const num = (v: number | null | undefined, d: number) => (v == null ? '—' : formatNumber(v, d));

function titleBlock(doc: Doc, fonts: Fonts, r: WalkthroughReport): void {
  const b = r.building;
  doc.font(fonts.regular).fontSize(9).fillColor(MUTED).text(pdfText(`Walkthrough report · ${b.installationName} (${b.installationCode})`, fonts), PAGE.margin, PAGE.margin);
  doc.moveDown(0.3);
  doc.font(fonts.bold).fontSize(20).fillColor(INK).text(pdfText(`Building ${b.number} · ${b.name}`, fonts), { width: contentWidth(doc) });
  if (r.walkthrough.title) doc.font(fonts.regular).fontSize(12).fillColor(INK).text(pdfText(r.walkthrough.title, fonts), { width: contentWidth(doc) });
  doc.moveDown(0.6);
  keyValues(doc, fonts, [
    ['Audit date', formatDate(auditDate(r))],
    ['Status', r.walkthrough.status],
    ['Auditor', r.walkthrough.auditor ? `${r.walkthrough.auditor.name} (${r.walkthrough.auditor.email})` : 'not assigned'],
    ['Audit level', 'ASHRAE Standard 211 Level 1 (walk-through)'],
    ['Planned for', formatDate(r.walkthrough.plannedOn)],
    ['Report made', `${formatDate(r.generatedAt.slice(0, 10))} ${r.generatedAt.slice(11, 16)} UTC`],
  ]);
}

function buildingSummary(doc: Doc, fonts: Fonts, r: WalkthroughReport): void {
  const b = r.building;
  const bm = r.benchmark;
  heading(doc, fonts, 'Building and benchmark');
  const ratio = bm?.siteEui != null && bm.peerMedianEui ? `${formatNumber(bm.siteEui / bm.peerMedianEui, 2)} × the peer median` : '—';
  keyValues(doc, fonts, [
    ['Use type', USE_TYPE_LABELS[b.useType]],
    ['Gross floor area', `${formatNumber(b.grossAreaFt2)} ft²`],
    ['Year built', b.yearBuilt === null ? 'unknown' : String(b.yearBuilt)],
    ['Occupants', b.occupants === null ? '—' : formatNumber(b.occupants)],
    ['Address', b.address ?? '—'],
    ['Climate', b.climate ?? '—'],
    ['Site EUI', bm?.siteEui != null ? `${formatNumber(bm.siteEui, 1)} kBtu/ft²·yr` : 'not computed'],
    ['Weather-normalized EUI', bm?.euiNormalized != null ? `${formatNumber(bm.euiNormalized, 1)} kBtu/ft²·yr` : 'not computed'],
    ['Peer median site EUI', bm?.peerMedianEui != null ? `${formatNumber(bm.peerMedianEui, 1)} kBtu/ft²·yr (${bm.peerGroup ?? ''})` : '—'],
    ['Against the peers', ratio],
  ]);
  if (bm) paragraph(doc, fonts, `Intensities over the 12 months ${formatDate(bm.windowStart)} – ${formatDate(bm.windowEnd)}. Peer median: ${bm.peerSource ?? 'U.S. EIA, 2018 CBECS'}.`, { size: 8, color: MUTED });
  if (r.baselines.length > 0) {
    heading(doc, fonts, 'Baselines', 2);
    const cols = widths(doc, [1.4, 0.6, 1.8, 0.6, 0.8, 1, 1.6]).map((width, i) => ({ width, header: ['Commodity', 'Unit', 'Model', 'R²', 'CV(RMSE)', 'Status', 'Baseline period'][i]!, align: i === 3 || i === 4 ? ('right' as const) : ('left' as const) }));
    table(doc, fonts, cols, r.baselines.map((x) => [COMMODITY_LABELS[x.commodity], x.unit, x.shape ? `${x.shape}${x.parameters ? ` (${x.parameters}-parameter)` : ''}` : 'no model', num(x.r2, 2), x.cvrmse == null ? '—' : `${formatNumber(x.cvrmse * 100, 1)} %`, x.status, x.periodStart && x.periodEnd ? `${formatDate(x.periodStart)} – ${formatDate(x.periodEnd)}` : '—']));
  }
}

function findingsAndMeasures(doc: Doc, fonts: Fonts, r: WalkthroughReport): void {
  heading(doc, fonts, 'Findings and measures');
  if (r.findings.length === 0) {
    paragraph(doc, fonts, 'No findings were recorded.', { color: MUTED });
    return;
  }
  const headers = ['#', 'Finding and measure', 'Status', 'Annual savings', 'Cost savings $/yr', 'Installed cost', 'Incentives', 'Life yr', 'Payback yr', 'SIR', 'AIRR %'];
  const cols = widths(doc, [0.3, 2.2, 1.1, 1.4, 0.9, 0.9, 0.95, 0.5, 0.8, 0.5, 0.6]).map((width, i) => ({ width, header: headers[i]!, align: i >= 4 ? ('right' as const) : ('left' as const) }));
  const rows = r.findings.map((f, i) => {
    const m = f.measure;
    const what = `${f.title}${f.location ? ` (${f.location})` : ''}\n${FINDING_CATEGORY_LABELS[f.category]}${m ? `\nMeasure: ${m.title}` : ''}`;
    if (!m || f.status === 'dismissed') return [String(i + 1), what, f.status === 'dismissed' ? 'dismissed' : 'no measure', '', '', '', '', '', '', '', ''];
    const e = m.economics;
    const costSavings = m.annualEnergyCostSavingsUsd + m.annualWaterCostSavingsUsd + m.annualOmCostSavingsUsd;
    return [String(i + 1), what, m.status + (m.implementedOn ? `\n${formatDate(m.implementedOn)}` : ''), savingsText(m), formatMoney(costSavings), formatMoney(m.installedCostUsd), formatMoney(m.incentivesUsd), String(m.lifeYears), num(e?.simplePaybackYears, 1), num(e?.sir, 2), num(e?.airrPercent, 1)];
  });
  table(doc, fonts, cols, rows, { size: 7.5 });
  const described = r.findings.filter((f) => f.description);
  if (described.length > 0) {
    heading(doc, fonts, 'What was found', 2);
    for (const f of described) paragraph(doc, fonts, `${r.findings.indexOf(f) + 1}. ${f.title}: ${f.description}`, { size: 9 });
  }
  const rates = [...new Map(reportMeasures(r).flatMap(({ measure: m }) => (m.economics?.discountRatePercent != null ? [[`${m.economics.discountRatePercent}|${m.economics.rateEffectiveFrom}`, m.economics] as const] : []))).values()];
  doc.moveDown(0.3);
  if (rates.length === 0) paragraph(doc, fonts, 'No economics were computed for these measures.', { size: 8.5, color: MUTED });
  for (const e of rates) {
    paragraph(doc, fonts, `Economics per 10 CFR 436 Subpart A and NIST Handbook 135 at a real discount rate of ${formatNumber(e.discountRatePercent!, 1)} %${e.rateEffectiveFrom ? `, in force from ${formatDate(e.rateEffectiveFrom)}` : ''}${e.rateSource ? ` (${e.rateSource})` : ''}. Simple payback = (installed cost − incentives) ÷ annual savings; SIR = present value of savings ÷ net investment; AIRR = (1 + d)·SIR^(1/n) − 1.`, { size: 8.5, color: MUTED });
  }
}

function rollUpSection(doc: Doc, fonts: Fonts, r: WalkthroughReport): void {
  const t = rollUpMeasures(r);
  heading(doc, fonts, 'Roll-up');
  if (t.measureCount === 0) {
    paragraph(doc, fonts, 'No measures to total (rejected measures are not counted).', { color: MUTED });
    return;
  }
  keyValues(doc, fonts, [
    ['Measures counted', `${t.measureCount} (proposed ${t.byStatus.proposed}, approved ${t.byStatus.approved}, implemented ${t.byStatus.implemented}; ${t.byStatus.rejected} rejected not counted)`],
    ['Annual savings', t.savings.map((s) => `${formatNumber(s.quantity, 0)} ${s.unit} ${COMMODITY_LABELS[s.commodity].toLowerCase()}`).join('; ')],
    ['Site energy saved', `${formatNumber(t.siteKbtu / 1000, 1)} MMBtu/yr`],
    ['Water saved', `${formatNumber(t.waterGallons, 0)} gal/yr`],
    ['Cost savings', `${formatMoney(t.annualCostSavingsUsd)}/yr (energy ${formatMoney(t.annualEnergyCostSavingsUsd)}, water ${formatMoney(t.annualWaterCostSavingsUsd)}, O&M ${formatMoney(t.annualOmCostSavingsUsd)})`],
    ['Installed cost', `${formatMoney(t.installedCostUsd)} less ${formatMoney(t.incentivesUsd)} incentives`],
    ['Simple payback', t.simplePaybackYears === null ? 'does not pay back' : `${formatNumber(t.simplePaybackYears, 1)} years`],
    ['Package SIR', t.sir === null ? '—' : `${formatNumber(t.sir, 2)} at ${formatNumber(t.discountRatePercent!, 1)} %`],
  ]);
}

function photosSection(doc: Doc, fonts: Fonts, r: WalkthroughReport, read: PdfOptions['photo']): void {
  // Keep the heading with the first row of pictures.
  if (r.photos.some((p) => EMBEDDABLE.has(p.mime))) ensureSpace(doc, 260);
  heading(doc, fonts, 'Photos');
  if (r.photos.length === 0) {
    paragraph(doc, fonts, 'No photos were taken.', { color: MUTED });
    return;
  }
  const listed: string[][] = [];
  const w = (contentWidth(doc) - 18) / 2;
  let column = 0;
  let rowTop = doc.y;
  for (const p of r.photos) {
    const label = `${PHOTO_TAG_LABELS[p.tag]}${p.caption ? `: ${p.caption}` : ''}${p.findingTitle ? ` (finding: ${p.findingTitle})` : ''}`;
    const bytes = EMBEDDABLE.has(p.mime) && read ? read(p) : null;
    if (!bytes) {
      listed.push([PHOTO_TAG_LABELS[p.tag], p.caption, p.findingTitle ?? '', EMBEDDABLE.has(p.mime) ? 'file not found' : `${p.mime}: not embedded`]);
      continue;
    }
    if (column === 0) {
      ensureSpace(doc, 200);
      rowTop = doc.y;
    }
    const x = PAGE.margin + column * (w + 18);
    try {
      doc.image(bytes, x, rowTop, { fit: [w, 160], align: 'center' });
    } catch {
      listed.push([PHOTO_TAG_LABELS[p.tag], p.caption, p.findingTitle ?? '', 'image could not be read']);
      continue;
    }
    doc.font(fonts.regular).fontSize(8).fillColor(INK).text(pdfText(label, fonts), x, rowTop + 164, { width: w, height: 30, ellipsis: true });
    column = 1 - column;
    doc.y = column === 0 ? rowTop + 200 : rowTop;
  }
  if (column === 1) doc.y = rowTop + 200;
  doc.x = PAGE.margin;
  if (listed.length > 0) {
    heading(doc, fonts, 'Photos not shown', 2);
    table(doc, fonts, widths(doc, [1, 2.5, 2, 1.5]).map((width, i) => ({ width, header: ['Tag', 'Caption', 'Finding', 'Why'][i]! })), listed);
  }
}

function safetyNote(doc: Doc, fonts: Fonts): void {
  heading(doc, fonts, 'Safety');
  paragraph(
    doc,
    fonts,
    'Measurements on this walkthrough followed the site’s rules: readings on energized equipment only by qualified persons with the protective equipment NFPA 70E calls for; carbon monoxide watched during combustion testing; rotating machinery observed from outside its guards; ladders and mechanical rooms entered per site rules; equipment measured, never adjusted. Measures in this report are estimates from a Level 1 walk-through: their design and installation are for licensed professionals under local codes.',
    { size: 9 },
  );
  paragraph(doc, fonts, SAFETY_DEFERRAL, { size: 9, color: MUTED });
}

/** The report as PDF bytes. @throws ZodError on a report that does not match its schema. */
export async function renderWalkthroughPdf(input: WalkthroughReportInput, opts: PdfOptions = {}): Promise<Buffer> {
  const r = walkthroughReportSchema.parse(input);
  const { default: PDFDocument } = await import('pdfkit');
  const b = r.building;
  const doc = new PDFDocument({
    size: 'LETTER',
    margin: PAGE.margin,
    bufferPages: true,
    compress: opts.compress ?? true,
    info: { Title: `Walkthrough report: ${b.number} ${b.name}`, Author: r.walkthrough.auditor?.name ?? 'Plumbline', Subject: `ASHRAE Standard 211 Level 1 walk-through, ${auditDate(r)}`, Creator: 'Plumbline' },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const fonts = registerFonts(doc, opts.builtInFont ?? false);
  titleBlock(doc, fonts, r);
  buildingSummary(doc, fonts, r);
  findingsAndMeasures(doc, fonts, r);
  rollUpSection(doc, fonts, r);
  formSections(doc, fonts, r.walkthrough.form);
  photosSection(doc, fonts, r, opts.photo);
  safetyNote(doc, fonts);
  pageNumbers(doc, fonts, `${b.installationCode} ${b.number} · walkthrough of ${formatDate(auditDate(r))}`);
  doc.end();
  return done;
}
