import PDFDocument from 'pdfkit';
import type { UnitSystem } from '../../shared/schemas/common';
import { FINISHES } from '../../shared/calc/library/finishes';
import { toCsv, type CsvValue } from '../http/csv';
import type { RegisterRow } from '../../shared/schemas/register';
import type { RegisterQuery } from './register.service';
import { dateText, MATERIAL_WORDS, METHOD_WORDS, STATUS_WORDS, temperatureText, VERDICT_WORDS } from './register-words';

const finishName = (id: string | null) => (id ? (FINISHES.find((f) => f.id === id)?.name ?? id) : '');

const CSV_HEADER = [
  'source',
  'entry_id',
  'item_kind',
  'item_tag',
  'site',
  'location',
  'description',
  'surface_temperature_c',
  'method',
  'emissivity_setting',
  'surface_material',
  'surface_finish',
  'within_reach',
  'contact_seconds',
  'limit_c',
  'limit_governs',
  'limit_source',
  'verdict',
  'cautions',
  'status',
  'action',
  'owner',
  'due_date',
  'overdue',
  'status_note',
  'closed_by',
  'closed_at',
  'verification_temperature_c',
  'measured_at',
  'created_by',
  'created_at',
] as const;

/** The register as CSV: SI values (°C, s) with their unit in the column name, one row per entry or risk. */
export function registerCsv(rows: readonly RegisterRow[]): string {
  return toCsv(
    CSV_HEADER,
    rows.map((r): CsvValue[] => [
      r.source,
      r.id,
      r.item?.kind ?? '',
      r.item?.tag ?? '',
      r.siteName,
      r.location,
      r.description,
      r.measuredTemperatureC,
      r.method,
      r.emissivitySetting,
      r.surfaceMaterial ?? '',
      finishName(r.surfaceFinishId),
      r.withinReach,
      r.contactSeconds ?? r.verdict.contactSeconds,
      r.verdict.limitC === null ? null : Math.round(r.verdict.limitC * 10) / 10,
      r.verdict.governs ?? '',
      r.verdict.source,
      r.verdict.verdict,
      r.verdict.cautions.map((c) => c.code).join(' '),
      r.status ?? 'calculated',
      r.action,
      r.owner?.name ?? '',
      r.dueDate ?? '',
      r.overdue,
      r.statusNote,
      r.closedBy?.name ?? '',
      r.closedAt ?? '',
      r.verificationTemperatureC,
      r.measuredAt ?? '',
      r.createdBy?.name ?? '',
      r.createdAt ?? '',
    ]),
  );
}

const FONT_FILES = {
  regular: require.resolve('@expo-google-fonts/source-sans-3/400Regular/SourceSans3_400Regular.ttf'),
  semibold: require.resolve('@expo-google-fonts/source-sans-3/600SemiBold/SourceSans3_600SemiBold.ttf'),
  bold: require.resolve('@expo-google-fonts/source-sans-3/700Bold/SourceSans3_700Bold.ttf'),
};

const INK = '#1E2A33';
const MUTED = '#4F5E69';
const RULE = '#D9DDE0';
const TONE: Record<'fail' | 'caution' | 'pass', string> = { fail: '#B0182B', caution: '#8A5A00', pass: '#1E6B37' };

export type RegisterPdfInput = {
  rows: readonly RegisterRow[];
  teamName: string;
  unitSystem: UnitSystem;
  generatedAt: Date;
  filters: RegisterQuery;
  siteName?: string;
  counts: Record<string, number>;
};

function filterText(p: RegisterPdfInput): string {
  const f = p.filters;
  const parts = [
    p.siteName ? `site ${p.siteName}` : 'all sites',
    f.statuses ? `status ${f.statuses.map((s) => STATUS_WORDS[s].toLowerCase()).join(', ')}` : null,
    f.verdict ? `verdict ${f.verdict}` : null,
    f.overdue === true ? 'overdue only' : f.overdue === false ? 'not overdue' : null,
    f.source ? `${f.source} only` : null,
    f.ownerUserId ? 'one owner' : null,
    f.q ? `matching "${f.q}"` : null,
  ].filter(Boolean);
  return parts.join(' · ');
}

/** The register as a PDF (A4 landscape, Source Sans 3 embedded), in the reader's units. */
export function registerPdf(p: RegisterPdfInput): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    layout: 'landscape',
    margins: { top: 40, bottom: 44, left: 40, right: 40 },
    bufferPages: true,
    info: { Title: `Hot-surface register — ${p.teamName}`, Author: 'Lagline', Subject: 'Hot-surface register', CreationDate: p.generatedAt },
  });
  doc.registerFont('regular', FONT_FILES.regular);
  doc.registerFont('semibold', FONT_FILES.semibold);
  doc.registerFont('bold', FONT_FILES.bold);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const left = doc.page.margins.left;
  const width = doc.page.width - doc.page.margins.left - doc.page.margins.right;
  const bottom = () => doc.page.height - doc.page.margins.bottom;
  const u = p.unitSystem;

  doc.font('bold').fontSize(18).fillColor(INK).text('Hot-surface register', left, doc.y);
  doc.font('regular').fontSize(10).fillColor(MUTED);
  doc.text(`${p.teamName} · ${filterText(p)} · generated ${p.generatedAt.toISOString().slice(0, 16).replace('T', ' ')} UTC · temperatures in ${u === 'US' ? '°F' : '°C'}`);
  const c = p.counts;
  doc.text(
    `Open ${c.open ?? 0} · action assigned ${c.actionAssigned ?? 0} · made safe ${c.madeSafe ?? 0} · verified ${c.verified ?? 0} · accepted ${c.accepted ?? 0} · overdue ${c.overdue ?? 0} · calculated risks ${c.calculated ?? 0}`,
  );
  doc.moveDown(0.6);

  const cols = [
    { title: 'Site', w: 0.11 },
    { title: 'Location or tag', w: 0.2 },
    { title: 'Surface', w: 0.12 },
    { title: 'Limit', w: 0.08 },
    { title: 'Verdict', w: 0.13 },
    { title: 'Status', w: 0.12 },
    { title: 'Owner', w: 0.12 },
    { title: 'Due', w: 0.12 },
  ].map((col) => ({ ...col, w: col.w * width }));
  const pad = 3;

  const header = () => {
    let x = left;
    const y = doc.y;
    doc.font('semibold').fontSize(9).fillColor(MUTED);
    for (const col of cols) {
      doc.text(col.title, x + pad, y, { width: col.w - 2 * pad });
      x += col.w;
    }
    doc.y = y + 14;
    doc.moveTo(left, doc.y).lineTo(left + width, doc.y).lineWidth(0.8).strokeColor(INK).stroke();
    doc.y += 3;
  };

  const sources = new Map<string, number>();
  const sourceNumber = (s: string) => {
    if (!sources.has(s)) sources.set(s, sources.size + 1);
    return sources.get(s) as number;
  };

  header();
  if (p.rows.length === 0) {
    doc.font('regular').fontSize(10).fillColor(MUTED).text('Nothing on the register matches these filters.', left + pad, doc.y + 4);
  }
  for (const r of p.rows) {
    const v = r.verdict;
    const cells: { text: string; font?: string; color?: string }[] = [
      { text: r.siteName },
      {
        text: [r.location, r.item && r.item.tag !== r.location ? `${r.item.kind} ${r.item.tag}` : null, r.source === 'calculated' ? 'calculated by sizing' : null, r.description || null]
          .filter(Boolean)
          .join('\n'),
      },
      {
        text: `${temperatureText(r.measuredTemperatureC, u)}\n${METHOD_WORDS[r.method]}${r.emissivitySetting !== null ? `, ε ${r.emissivitySetting}` : ''}${r.surfaceMaterial ? `\n${MATERIAL_WORDS[r.surfaceMaterial]}` : ''}${r.withinReach ? '' : '\nout of reach'}`,
      },
      { text: v.limitC === null ? 'cold: not compared' : `${temperatureText(v.limitC, u)} [${sourceNumber(v.source)}]` },
      { text: `${VERDICT_WORDS[v.verdict]}${v.cautions.length ? `\n${v.cautions.map((x) => x.code.toLowerCase().replace(/_/g, ' ')).join('; ')}` : ''}`, font: 'semibold', color: TONE[v.verdict] },
      { text: `${r.status ? STATUS_WORDS[r.status] : 'Calculated risk'}${r.statusNote ? `\n${r.statusNote}` : ''}` },
      { text: `${r.owner?.name ?? '—'}${r.action ? `\n${r.action}` : ''}` },
      { text: `${r.dueDate ? dateText(r.dueDate) : '—'}${r.overdue ? '\nOVERDUE' : ''}`, color: r.overdue ? TONE.fail : undefined, font: r.overdue ? 'semibold' : undefined },
    ];
    doc.fontSize(9);
    const heights = cells.map((cell, i) => doc.font(cell.font ?? 'regular').heightOfString(cell.text, { width: cols[i].w - 2 * pad }));
    const h = Math.max(...heights) + 2 * pad;
    if (doc.y + h > bottom()) {
      doc.addPage();
      header();
    }
    const y = doc.y;
    let x = left;
    cells.forEach((cell, i) => {
      doc.font(cell.font ?? 'regular').fillColor(cell.color ?? INK).text(cell.text, x + pad, y + pad, { width: cols[i].w - 2 * pad });
      x += cols[i].w;
    });
    doc.y = y + h;
    doc.moveTo(left, doc.y).lineTo(left + width, doc.y).lineWidth(0.5).strokeColor(RULE).stroke();
  }

  const notes = (title: string, lines: string[]) => {
    doc.moveDown(0.8);
    if (doc.y + 40 > bottom()) doc.addPage();
    doc.font('semibold').fontSize(10).fillColor(INK).text(title, left, doc.y, { width });
    doc.font('regular').fontSize(8.5).fillColor(MUTED);
    for (const line of lines) doc.text(line, left, doc.y, { width });
  };
  if (sources.size) notes('Sources of the limits', [...sources.entries()].map(([s, n]) => `[${n}] ${s}`));
  const cautions = new Map<string, string>();
  for (const r of p.rows) for (const x of r.verdict.cautions) cautions.set(x.code, x.message);
  if (cautions.size) notes('Cautions', [...cautions.entries()].map(([code, m]) => `${code.toLowerCase().replace(/_/g, ' ')}: ${m}`));
  notes('How to read this register', [
    'Each surface is compared with the ISO 13732-1 burn threshold for its material and expected contact time (ASTM C1055 5 s basis when none is given), or the site\'s touch limit where that is lower. ' +
      'Calculated risks are lines and vessels whose current sizing leaves the surface above the touch limit. ' +
      'This register is an aid to, not a substitute for, the judgement of a competent person, the plant\'s specification and local codes.',
  ]);

  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const y = doc.page.height - doc.page.margins.bottom + 14;
    doc.page.margins.bottom = 0;
    doc.font('regular').fontSize(8).fillColor(MUTED).text(`Lagline · hot-surface register · page ${i + 1} of ${range.count}`, left, y, { width, align: 'right', lineBreak: false });
  }
  doc.end();
  return done;
}
