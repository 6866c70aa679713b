import { execFile } from 'node:child_process';
import path from 'node:path';

export type PdfText = { total: number; pages: { num: number; text: string }[]; text: string };

/**
 * The text of a PDF, page by page, read back with pdf-parse (`new PDFParse({ data }).getText()`) in a
 * child Node process (pdf.js needs dynamic imports, which jest's sandbox does not allow).
 */
export function pdfText(pdf: Buffer): Promise<PdfText> {
  return new Promise((resolve, reject) => {
    const child = execFile(process.execPath, [path.join(__dirname, 'pdf-text-child.js')], { maxBuffer: 256 << 20, cwd: path.resolve(__dirname, '../..') }, (err, stdout, stderr) => {
      if (err) return reject(new Error(`pdf-parse failed: ${stderr || err.message}`));
      const r = JSON.parse(stdout) as Omit<PdfText, 'text'>;
      resolve({ ...r, text: r.pages.map((p) => p.text).join('\n') });
    });
    child.stdin?.end(pdf);
  });
}
