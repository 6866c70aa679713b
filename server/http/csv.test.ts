import Papa from 'papaparse';
import { neutraliseFormula, toCsv } from './csv';

describe('CSV the product writes', () => {
  it('when fields hold commas, quotes and line breaks, then a standard parser reads them back unchanged', () => {
    const rows = [
      ['6"-ST-101', 'Steam, 12 bar', 'He said "hot"\nsecond line', 191.5, null],
      ['L-2', 'Café – ½"', '', -40, true],
    ];
    const csv = toCsv(['tag', 'service', 'note', 'temperature', 'flag'], rows);
    expect(csv.startsWith('\uFEFF')).toBe(true);
    expect(csv).toContain('\r\n');
    const parsed = Papa.parse<string[]>(csv.slice(1), { skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data[1]).toEqual(['6"-ST-101', 'Steam, 12 bar', 'He said "hot"\nsecond line', '191.5', '']);
    expect(parsed.data[2]).toEqual(['L-2', 'Café – ½"', '', '-40', 'true']);
  });

  it('when text starts like a formula, then it is written as text; numbers stay numbers', () => {
    for (const t of ['=1+2', '+SUM(A1)', '-2+3', '@cmd', '\t=x']) expect(neutraliseFormula(t)).toBe(`'${t}`);
    expect(neutraliseFormula(-12.5)).toBe('-12.5');
    expect(neutraliseFormula('plain')).toBe('plain');
    const csv = toCsv(['a'], [['=HYPERLINK("http://x","y")']]);
    expect(csv).toContain(`"'=HYPERLINK(""http://x"",""y"")"`);
  });
});
