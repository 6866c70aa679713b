// Reads a PDF from stdin and writes its text per page as JSON ({ total, pages: [{ num, text }] }).
// Runs as its own Node process: pdf.js loads its worker with a dynamic import, which jest's module
// sandbox refuses.
const { PDFParse } = require('pdf-parse');

const chunks = [];
process.stdin.on('data', (c) => chunks.push(c));
process.stdin.on('end', async () => {
  const parser = new PDFParse({ data: new Uint8Array(Buffer.concat(chunks)) });
  try {
    const r = await parser.getText();
    process.stdout.write(JSON.stringify({ total: r.total, pages: r.pages.map((p) => ({ num: p.num, text: p.text })) }));
  } catch (e) {
    process.stderr.write(String(e && e.stack ? e.stack : e));
    process.exitCode = 1;
  } finally {
    await parser.destroy();
  }
});
