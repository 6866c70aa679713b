/**
 * The one PDF layout of Lagline's reports: A4 landscape, Source Sans 3 embedded, a title block on the first
 * page (site, report, revision and its purpose, date, prepared / checked / approved with their dates), a
 * running head and foot on every page ("page n of N"), tables whose header row repeats on every page and whose
 * cells wrap instead of cutting text, and a light "not issued" mark across drafts and unsigned revisions.
 */
import PDFDocument from 'pdfkit';

/** A4 landscape in points. */
const PAGE = { width: 841.89, height: 595.28 };
const MARGIN = { left: 32, right: 32, top: 50, bottom: 44 };
const CONTENT_WIDTH = PAGE.width - MARGIN.left - MARGIN.right;
const INK = '#1E2A33';
const MUTED = '#4F5E69';
const RULE = '#B9C1C7';
const SHADE = '#F1ECE4';
const HEAT = '#B23A12';

const FONT_FILES = {
  regular: require.resolve('@expo-google-fonts/source-sans-3/400Regular/SourceSans3_400Regular.ttf'),
  semibold: require.resolve('@expo-google-fonts/source-sans-3/600SemiBold/SourceSans3_600SemiBold.ttf'),
  bold: require.resolve('@expo-google-fonts/source-sans-3/700Bold/SourceSans3_700Bold.ttf'),
} as const;
type Weight = keyof typeof FONT_FILES;

export type Column = {
  header: string;
  /** Share of the content width (the shares of a table are scaled to fill it). */
  width: number;
  align?: 'left' | 'right';
};

export type TableRow = { cells: string[]; weight?: Weight; shade?: boolean; tone?: 'heat' };

export type Block =
  | { kind: 'heading'; text: string }
  | { kind: 'paragraph'; text: string; size?: number; tone?: 'muted' | 'heat' }
  | { kind: 'definitions'; rows: [string, string][] }
  | { kind: 'table'; columns: Column[]; rows: TableRow[]; fontSize?: number };

export type Signatory = { role: 'Prepared' | 'Checked' | 'Approved'; name: string | null; at: string | null };

export type ReportDocument = {
  /** "Insulation schedule". */
  title: string;
  site: string;
  /** "Rev B — Issued for review", or "Draft (not issued)". */
  revision: string;
  /** Shown in the running head: "Rev B" or "Draft". */
  revisionShort: string;
  /** "Issued", "Prepared, awaiting check", "Draft". */
  status: string;
  /** The document's date (issue date, preparation date, or the day a draft was printed). */
  date: string;
  units: string;
  description?: string;
  signatories: Signatory[];
  /** When the document was made (issue or preparation; now for a draft). */
  createdAt: Date;
  /** Printed lightly across every page of a draft or an unsigned revision. */
  watermark?: string;
  blocks: Block[];
};

const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

type Doc = InstanceType<typeof PDFDocument>;

class Layout {
  y = MARGIN.top;
  private rowsSinceYield = 0;
  constructor(readonly doc: Doc) {}

  font(weight: Weight, size: number, color = INK) {
    this.doc.font(weight).fontSize(size).fillColor(color);
    return this;
  }

  get bottom() {
    return PAGE.height - MARGIN.bottom;
  }

  newPage() {
    this.doc.addPage({ size: 'A4', layout: 'landscape', margin: 0 });
    this.y = MARGIN.top;
  }

  ensure(height: number): boolean {
    if (this.y + height <= this.bottom) return false;
    this.newPage();
    return true;
  }

  /** Splits text into lines no wider than `width` at the current font (words longer than a line are cut). */
  wrap(text: string, width: number): string[] {
    const doc = this.doc;
    if (text === '') return [''];
    if (doc.widthOfString(text) <= width) return [text];
    const lines: string[] = [];
    for (const paragraph of text.split('\n')) {
      let line = '';
      for (const word of paragraph.split(/ +/)) {
        const next = line ? `${line} ${word}` : word;
        if (doc.widthOfString(next) <= width) {
          line = next;
          continue;
        }
        if (line) lines.push(line);
        let w = word;
        while (doc.widthOfString(w) > width && w.length > 1) {
          let cut = w.length - 1;
          while (cut > 1 && doc.widthOfString(w.slice(0, cut)) > width) cut--;
          lines.push(w.slice(0, cut));
          w = w.slice(cut);
        }
        line = w;
      }
      lines.push(line);
    }
    return lines;
  }

  textLine(text: string, x: number, y: number, width: number, align: 'left' | 'right' = 'left') {
    const dx = align === 'right' ? Math.max(0, width - this.doc.widthOfString(text)) : 0;
    this.doc.text(text, x + dx, y, { lineBreak: false });
  }

  paragraph(text: string, size = 9, tone?: 'muted' | 'heat') {
    this.font('regular', size, tone === 'muted' ? MUTED : tone === 'heat' ? HEAT : INK);
    const lh = size * 1.3;
    for (const line of this.wrap(text, CONTENT_WIDTH)) {
      this.ensure(lh);
      this.textLine(line, MARGIN.left, this.y, CONTENT_WIDTH);
      this.y += lh;
    }
    this.y += size * 0.4;
  }

  heading(text: string) {
    this.ensure(40);
    this.y += 6;
    this.font('bold', 12);
    this.textLine(text, MARGIN.left, this.y, CONTENT_WIDTH);
    this.y += 18;
  }

  definitions(rows: [string, string][]) {
    const size = 9;
    const lh = size * 1.3;
    const keyWidth = 190;
    for (const [k, v] of rows) {
      this.font('regular', size);
      const lines = this.wrap(v, CONTENT_WIDTH - keyWidth - 8);
      this.ensure(lh * lines.length);
      this.font('semibold', size, MUTED);
      this.textLine(k, MARGIN.left, this.y, keyWidth);
      this.font('regular', size);
      lines.forEach((l, i) => this.textLine(l, MARGIN.left + keyWidth + 8, this.y + i * lh, CONTENT_WIDTH - keyWidth - 8));
      this.y += lh * lines.length + 1;
    }
    this.y += 4;
  }

  async table(columns: Column[], rows: TableRow[], size = 8) {
    const total = columns.reduce((s, c) => s + c.width, 0);
    const widths = columns.map((c) => (c.width / total) * CONTENT_WIDTH);
    const xs = widths.map((_, i) => MARGIN.left + widths.slice(0, i).reduce((s, w) => s + w, 0));
    const pad = 3;
    const lh = size * 1.25;
    const header = () => {
      this.font('semibold', size, INK);
      const lines = columns.map((c, i) => this.wrap(c.header, widths[i] - 2 * pad));
      const h = Math.max(...lines.map((l) => l.length)) * lh + 2 * pad;
      this.doc.rect(MARGIN.left, this.y, CONTENT_WIDTH, h).fill(SHADE);
      this.font('semibold', size, INK);
      lines.forEach((ls, i) => ls.forEach((l, k) => this.textLine(l, xs[i] + pad, this.y + pad + k * lh, widths[i] - 2 * pad, columns[i].align)));
      this.y += h;
      this.doc.moveTo(MARGIN.left, this.y).lineTo(MARGIN.left + CONTENT_WIDTH, this.y).lineWidth(0.6).strokeColor(INK).stroke();
    };
    this.ensure(4 * lh);
    header();
    for (const row of rows) {
      const weight = row.weight ?? 'regular';
      this.font(weight, size);
      const lines = row.cells.map((c, i) => this.wrap(c, widths[i] - 2 * pad));
      const h = Math.max(...lines.map((l) => l.length)) * lh + pad;
      if (this.ensure(h)) header();
      if (row.shade) this.doc.rect(MARGIN.left, this.y, CONTENT_WIDTH, h).fill(SHADE);
      this.font(weight, size, row.tone === 'heat' ? HEAT : INK);
      lines.forEach((ls, i) => ls.forEach((l, k) => this.textLine(l, xs[i] + pad, this.y + pad / 2 + k * lh, widths[i] - 2 * pad, columns[i].align)));
      this.y += h;
      this.doc.moveTo(MARGIN.left, this.y).lineTo(MARGIN.left + CONTENT_WIDTH, this.y).lineWidth(0.3).strokeColor(RULE).stroke();
      if (++this.rowsSinceYield >= 250) {
        this.rowsSinceYield = 0;
        await yieldToEventLoop();
      }
    }
    this.y += 8;
  }
}

function titleBlock(l: Layout, d: ReportDocument) {
  const doc = l.doc;
  const x0 = MARGIN.left;
  const colW = CONTENT_WIDTH / 3;
  const cellH = 34;
  const cells: [string, string][][] = [
    [
      ['Site', d.site],
      ['Report', d.title],
      ['Revision', d.revision],
    ],
    [
      ['Date', d.date],
      ['Status', d.status],
      ['Units', d.units],
    ],
    d.signatories.map((s) => [s.role, s.name ? `${s.name}${s.at ? ` — ${s.at}` : ''}` : 'not yet signed'] as [string, string]),
  ];
  l.font('bold', 16);
  l.textLine(`Lagline — ${d.title}`, x0, l.y, CONTENT_WIDTH);
  l.y += 26;
  let y = l.y;
  const valueLine = 13;
  for (const row of cells) {
    // A long site name or signatory wraps within its cell; the row grows to the tallest cell.
    const weight = (c: number, r: number): Weight => (r === 0 && c === 0 ? 'semibold' : 'regular');
    const r = cells.indexOf(row);
    const lines = row.map(([, v], c) => {
      l.font(weight(c, r), 10.5);
      return l.wrap(v, colW - 10);
    });
    const h = Math.max(cellH, 18 + Math.max(...lines.map((x) => x.length)) * valueLine);
    row.forEach(([k], c) => {
      const x = x0 + c * colW;
      doc.rect(x, y, colW, h).lineWidth(0.6).strokeColor(INK).stroke();
      l.font('semibold', 7.5, MUTED);
      l.textLine(k.toUpperCase(), x + 5, y + 4, colW - 10);
      l.font(weight(c, r), 10.5);
      lines[c].forEach((line, i) => l.textLine(line, x + 5, y + 15 + i * valueLine, colW - 10));
    });
    y += h;
  }
  l.y = y + 10;
  if (d.description) l.paragraph(d.description, 9, 'muted');
}

function runningHeadAndFoot(doc: Doc, d: ReportDocument, page: number, pages: number) {
  const l = new Layout(doc);
  l.font('semibold', 8, MUTED);
  l.textLine(`Lagline · ${d.title} · ${d.site}`, MARGIN.left, 24, CONTENT_WIDTH / 2);
  l.textLine(`${d.revisionShort} · ${d.status} · ${d.date}`, MARGIN.left + CONTENT_WIDTH / 2, 24, CONTENT_WIDTH / 2, 'right');
  doc.moveTo(MARGIN.left, 36).lineTo(PAGE.width - MARGIN.right, 36).lineWidth(0.4).strokeColor(RULE).stroke();
  const fy = PAGE.height - 30;
  doc.moveTo(MARGIN.left, fy - 6).lineTo(PAGE.width - MARGIN.right, fy - 6).lineWidth(0.4).strokeColor(RULE).stroke();
  l.font('regular', 7.5, MUTED);
  l.textLine('An aid to, not a substitute for, a competent engineer, the plant’s insulation specification and local codes.', MARGIN.left, fy, CONTENT_WIDTH * 0.75);
  l.font('semibold', 8, INK);
  l.textLine(`page ${page} of ${pages}`, MARGIN.left + CONTENT_WIDTH * 0.75, fy, CONTENT_WIDTH * 0.25, 'right');
  if (d.watermark) {
    doc.save();
    doc.rotate(-24, { origin: [PAGE.width / 2, PAGE.height / 2] });
    doc.font('bold').fontSize(64).fillColor(HEAT).fillOpacity(0.07);
    const w = doc.widthOfString(d.watermark);
    doc.text(d.watermark, PAGE.width / 2 - w / 2, PAGE.height / 2 - 32, { lineBreak: false });
    doc.restore();
  }
}

/** Renders a report to a PDF file's bytes. Yields to the event loop between rows so a long report never stalls the server. */
export async function renderPdf(d: ReportDocument): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    layout: 'landscape',
    margin: 0,
    bufferPages: true,
    autoFirstPage: true,
    // The document's own date, not the moment of printing.
    info: { Title: `${d.title} — ${d.site} — ${d.revisionShort}`, Author: 'Lagline', Subject: d.title, Creator: 'Lagline', CreationDate: d.createdAt },
  });
  for (const [name, file] of Object.entries(FONT_FILES)) doc.registerFont(name, file);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const l = new Layout(doc);
  titleBlock(l, d);
  for (const b of d.blocks) {
    switch (b.kind) {
      case 'heading':
        l.heading(b.text);
        break;
      case 'paragraph':
        l.paragraph(b.text, b.size, b.tone);
        break;
      case 'definitions':
        l.definitions(b.rows);
        break;
      case 'table':
        await l.table(b.columns, b.rows, b.fontSize);
        break;
    }
  }
  const range = doc.bufferedPageRange();
  for (let i = 0; i < range.count; i++) {
    doc.switchToPage(range.start + i);
    runningHeadAndFoot(doc, d, i + 1, range.count);
  }
  doc.end();
  return done;
}
