/**
 * Reports read back: the insulation schedule, heat-loss summary and take-off of an issued revision and of the
 * draft, in SI and US units, as PDF (text extracted with pdf-parse) and CSV. Checks the title block, a known
 * line's row, the totals against the items' own results, the take-off against a hand calculation, paging of a
 * long schedule, that every printed glyph is in the embedded font, and bad queries.
 */
import fontkit from 'fontkit';
import Papa from 'papaparse';
import type { Response } from 'supertest';
import { displayUnits } from '../../server/reports/display';
import { addMember, type Agent, type ApiContext, createApiContext, signUpOwner } from '../helpers/api';
import { pdfText } from '../helpers/pdf-text';
import { sizeSiteAndWait } from '../helpers/sizing';

jest.setTimeout(180_000);

let ctx: ApiContext;
let owner: Agent;
let preparer: Agent;
let checker: Agent;
let siteId: number;
let revA: { id: number; number: string; prepared: { name: string; at: string }; checked: { name: string; at: string }; approved: { name: string; at: string } };

const BASES = {
  touch: { airTemperatureC: 35, windSpeedMS: 0, contactSeconds: 5 },
  energy: {
    airTemperatureC: 10,
    windSpeedMS: 3,
    operatingHoursPerYear: 8000,
    energyPricePerKWh: 0.05,
    currency: 'EUR',
    heatSourceEfficiency: 0.85,
    co2KgPerKWh: 0.2,
    co2Basis: 'Natural gas, combustion',
  },
  condensation: { airTemperatureC: 30, relativeHumidityPct: 80, marginK: 1 },
};
const MF = 'mineral-fibre-pipe-c547-type-ii';
const BOARD = 'mineral-fibre-board-c612-type-iva';

const post = (a: Agent, path: string, body: object = {}) => a.post(path).set('X-CSRF-Token', a.csrf).send(body);

/** supertest keeps binary bodies only when asked. */
const binary = (res: Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};
async function pdf(a: Agent, path: string) {
  const res = await a.get(path).buffer(true).parse(binary as never).expect(200);
  expect(res.headers['content-type']).toBe('application/pdf');
  expect((res.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
  return { res, text: await pdfText(res.body as Buffer) };
}

type Sizing = { heatLossWPerM: number; heatLossW: number; surfaceTemperatureC: number; annualEnergyKWh: number; totalThicknessM: number; governingPurpose: string };
async function items(a: Agent) {
  const lines = (await a.get(`/api/v1/sites/${siteId}/lines`).expect(200)).body.lines as { tag: string; sizing: Sizing }[];
  const vessels = (await a.get(`/api/v1/sites/${siteId}/vessels`).expect(200)).body.vessels as { tag: string; sizing: Sizing }[];
  return Object.fromEntries([...lines, ...vessels].map((x) => [x.tag, x.sizing]));
}

beforeAll(async () => {
  ctx = await createApiContext();
  const o = await signUpOwner(ctx, { teamName: 'Report team' });
  owner = o.agent;
  preparer = (await addMember(ctx, owner, 'engineer')).agent;
  checker = (await addMember(ctx, owner, 'engineer')).agent;
  siteId = (await post(owner, '/api/v1/sites', { name: 'Report works', designBases: BASES }).expect(201)).body.site.id;
  const line = (body: object) => post(preparer, `/api/v1/sites/${siteId}/lines`, { purposes: ['personnelProtection'], ...body }).expect(201);
  // Existing two-layer insulation on a 4-inch steam line: thicknesses known, so the take-off can be checked by hand.
  await line({
    tag: 'ST-100',
    service: 'HP steam',
    nps: '4',
    lengthM: 100,
    operatingTemperatureC: 190,
    purposes: ['personnelProtection', 'heatConservation'],
    fittings: { valves: 2, flanges: 4, elbows: 3, tees: 1 },
    buildUp: { layers: [{ materialId: MF, thicknessM: 0.05 }, { materialId: MF, thicknessM: 0.04 }], finishId: 'aluminium-oxidised', fixed: true },
  });
  await line({ tag: 'ST-200', service: 'LP steam', nps: '2', lengthM: 30, operatingTemperatureC: 150, buildUp: { layers: [{ materialId: 'calcium-silicate-c533-type-i' }], finishId: 'pvc-jacket' } });
  // A bare vent whose tag a spreadsheet would run as a formula.
  await line({ tag: '+CMD|calc', service: 'Vent', nps: '1', lengthM: 10, operatingTemperatureC: 120, fittings: { valves: 1, flanges: 0 }, buildUp: { layers: [], finishId: 'carbon-steel-oxidised', fixed: true } });
  await post(preparer, `/api/v1/sites/${siteId}/vessels`, {
    tag: 'V-10',
    service: 'Flash drum',
    diameterM: 2,
    lengthM: 5,
    orientation: 'horizontal',
    headType: 'flat',
    operatingTemperatureC: 150,
    purposes: ['personnelProtection'],
    buildUp: { layers: [{ materialId: BOARD, thicknessM: 0.08 }], finishId: 'aluminium-oxidised', fixed: true },
  }).expect(201);
  await sizeSiteAndWait(preparer, siteId);
  const prepared = (await post(preparer, `/api/v1/sites/${siteId}/revisions`, { purpose: 'review', description: 'Schedule for the boiler-house tender' }).expect(201)).body.revision;
  await post(checker, `/api/v1/revisions/${prepared.id}/check`, { snapshotHash: prepared.snapshotHash }).expect(200);
  revA = (await post(owner, `/api/v1/revisions/${prepared.id}/approve`, { snapshotHash: prepared.snapshotHash }).expect(200)).body.revision;
});
afterAll(async () => {
  await ctx.close();
});

const font = fontkit.openSync(require.resolve('@expo-google-fonts/source-sans-3/400Regular/SourceSans3_400Regular.ttf'));
/** Characters of the text the embedded font has no glyph for (they would print as empty boxes). */
const missingGlyphs = (text: string) => [...new Set([...text].filter((ch) => !/\s/.test(ch) && !font.hasGlyphForCodePoint(ch.codePointAt(0) as number)))];

describe('insulation schedule', () => {
  it('when an issued revision is printed, then the title block names the site, revision, date and all three signatories', async () => {
    const { text, res } = await pdf(owner, `/api/v1/sites/${siteId}/reports/insulation-schedule.pdf?revision=${revA.id}&units=SI`);
    expect(res.headers['content-disposition']).toBe('attachment; filename="Report_works_rev-A_insulation-schedule_SI.pdf"');
    const first = text.pages[0].text;
    expect(first).toContain('Lagline — Insulation schedule');
    expect(first).toMatch(/SITE\nReport works\n/);
    expect(first).toMatch(/REVISION\nRev A — Issued for review\n/);
    expect(first).toMatch(new RegExp(`DATE\\n${revA.approved.at.slice(0, 10)}\\n`));
    expect(first).toMatch(/STATUS\nIssued\n/);
    expect(first).toMatch(/UNITS\nSI \(°C, mm, m, W\)/);
    const at = (iso: string) => `${iso.slice(0, 16).replace('T', ' ')} UTC`;
    expect(first).toContain(`PREPARED\n${revA.prepared.name} — ${at(revA.prepared.at)}`);
    expect(first).toContain(`CHECKED\n${revA.checked.name} — ${at(revA.checked.at)}`);
    expect(first).toContain(`APPROVED\n${revA.approved.name} — ${at(revA.approved.at)}`);
    expect(first).toContain('Schedule for the boiler-house tender');
    expect(text.text).not.toContain('NOT ISSUED');
    expect(text.text).toContain(`page 1 of ${text.total}`);
    expect(text.text).toContain('An aid to, not a substitute for, a competent engineer');
    expect(text.text).toMatch(/Cautions\nThese results are an aid to, not a substitute for, the judgement of a competent engineer/);
  });

  it('when the schedule is read back, then the known line prints its row and the totals add up the items', async () => {
    const { text } = await pdf(owner, `/api/v1/sites/${siteId}/reports/insulation-schedule.pdf?revision=${revA.id}&units=SI`);
    const s = (await items(owner))['ST-100'];
    const du = displayUnits('SI');
    // Legend: materials and finishes by code, as the schedule's columns use them.
    expect(text.text).toContain('M1 Mineral-fibre pipe insulation, up to 650 °C');
    const alu = text.text.match(/\n(F\d) Aluminium jacket, oxidised or dull \(in service\)\n/)![1];
    const row = `ST-100 HP steam NPS 4 190 °C PP HC ${s.governingPurpose === 'heatConservation' ? 'HC' : 'PP'} M1 50 + 40 mm ${alu} ${du.temperature(s.surfaceTemperatureC)} ${du.heatLossPerLength(s.heatLossWPerM)} ${du.heatFlow(s.heatLossW)}`;
    expect(text.text).toContain(row);
    // The bare vent fails personnel protection and says so.
    expect(text.text).toMatch(/\+CMD\|calc Vent NPS 1 120 °C PP PP bare F\d 120\.0 °C .*fails PP; burn risk/);
    const all = await items(owner);
    const lineTotal = all['ST-100'].heatLossW + all['ST-200'].heatLossW + all['+CMD|calc'].heatLossW;
    expect(text.text).toContain(`Total: 3 lines ${du.bigHeatFlow(lineTotal)}`);
    expect(text.text).toContain(`Total: 1 vessel ${du.bigHeatFlow(all['V-10'].heatLossW)}`);
    expect(text.text).toContain(`Site total: 4 items, heat loss ${du.bigHeatFlow(lineTotal + all['V-10'].heatLossW)} at the energy basis.`);
  });

  it('when the draft is printed in US units, then it says it is not issued and prints °F, inches and Btu/h', async () => {
    const { text, res } = await pdf(owner, `/api/v1/sites/${siteId}/reports/insulation-schedule.pdf?units=US`);
    expect(res.headers['content-disposition']).toContain('Report_works_draft_insulation-schedule_US.pdf');
    expect(text.text).toMatch(/REVISION\nDraft\n/);
    expect(text.text).toMatch(/STATUS\nNot issued\n/);
    expect(text.text).toContain('DRAFT — NOT ISSUED');
    expect(text.text).toMatch(/PREPARED\nnot yet signed/);
    const s = (await items(owner))['ST-100'];
    const du = displayUnits('US');
    // 190 °C = 374 °F; 50 + 40 mm = 2 + 1⅝ in (nearest eighth).
    expect(text.text).toContain(`ST-100 HP steam NPS 4 374 °F PP HC`);
    const alu = text.text.match(/\n(F\d) Aluminium jacket, oxidised or dull \(in service\)\n/)![1];
    expect(text.text).toContain(`M1 2 + 1⅝ in ${alu} ${du.temperature(s.surfaceTemperatureC)} ${du.heatLossPerLength(s.heatLossWPerM)}`);
    expect(du.temperature(s.surfaceTemperatureC)).toMatch(/°F$/);
  });

  it('when the caller sets no units, then the report follows their setting', async () => {
    await owner.patch('/api/v1/me/settings').set('X-CSRF-Token', owner.csrf).send({ unitSystem: 'US' }).expect(200);
    const { text } = await pdf(owner, `/api/v1/sites/${siteId}/reports/insulation-schedule.pdf?revision=${revA.id}`);
    expect(text.text).toContain('US customary (°F, in, ft, Btu/h)');
    await owner.patch('/api/v1/me/settings').set('X-CSRF-Token', owner.csrf).send({ unitSystem: 'SI' }).expect(200);
  });

  it('when the schedule is downloaded as CSV, then it is RFC 4180 with a BOM, numbers in the named units, formulas neutralised', async () => {
    const res = await owner.get(`/api/v1/sites/${siteId}/reports/insulation-schedule.csv?revision=${revA.id}&units=SI`).expect(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(res.headers['content-disposition']).toBe('attachment; filename="Report_works_rev-A_insulation-schedule_SI.csv"');
    const lines = res.text.split('\r\n');
    expect(lines[0]).toBe(
      '\uFEFFKind,Tag,Service,Size,Outer diameter [mm],Length [m],Operating temperature [°C],Location,Purposes,Governing purpose,Layers inside out (material, thickness),Total thickness [mm],Finish,Surface temperature [°C],Heat loss per length [W/m],Heat loss [W],Annual energy [MWh],Burn check,Purposes not met,Sizing status'.replace(
        'Layers inside out (material, thickness)',
        '"Layers inside out (material, thickness)"',
      ),
    );
    const s = (await items(owner))['ST-100'];
    const st100 = lines.find((l) => l.startsWith('line,ST-100,'))!;
    expect(st100).toContain('line,ST-100,HP steam,NPS 4,114.3,100,190,outdoor,"personnel protection, heat conservation",');
    expect(st100).toContain(`"Mineral-fibre pipe insulation, up to 650 °C 50 + 40 mm",90,"Aluminium jacket, oxidised or dull (in service)",${Math.round(s.surfaceTemperatureC * 10) / 10},`);
    expect(lines.some((l) => l.startsWith("line,'+CMD|calc,Vent,"))).toBe(true);
    expect(lines[lines.length - 1]).toBe('');
    expect(lines.filter((l) => l !== '')).toHaveLength(5);
  });
});

describe('heat-loss summary', () => {
  it('when the summary is read back, then the site totals are the items’ heat loss, energy, cost and CO₂ at the energy basis', async () => {
    const { text } = await pdf(owner, `/api/v1/sites/${siteId}/reports/heat-loss-summary.pdf?revision=${revA.id}&units=SI`);
    const all = Object.values(await items(owner));
    const heatW = all.reduce((s, x) => s + x.heatLossW, 0);
    const heatKWh = all.reduce((s, x) => s + x.annualEnergyKWh, 0);
    // Bought = heat ÷ 0.85; cost = bought × 0.05 EUR/kWh; CO₂ = bought × 0.2 kg/kWh.
    const boughtKWh = heatKWh / 0.85;
    const cost = Math.round(boughtKWh * 0.05 * 100) / 100;
    const co2t = (boughtKWh * 0.2) / 1000;
    const du = displayUnits('SI');
    const siteRow = text.text.split('\n').find((l) => l.startsWith('Site total'))!;
    expect(siteRow).toContain(`Site total 4 ${du.bigHeatFlow(heatW)} `);
    expect(siteRow).toContain(` ${du.bigEnergy(heatKWh)} ${du.bigEnergy(boughtKWh)} ${du.money(cost, 'EUR')} ${du.co2(co2t)} `);
    expect(text.text).toMatch(/Hot service, total 4 /);
    expect(text.text).toContain('HP steam 1 ');
    expect(text.text).toContain('energy 0.05 EUR/kWh, heat-source efficiency 85 %, CO₂ 0.200 kg CO₂/kWh (Natural gas, combustion)');
    expect(text.text).toContain('8000 h a year');

    const csv = (await owner.get(`/api/v1/sites/${siteId}/reports/heat-loss-summary.csv?revision=${revA.id}&units=SI`).expect(200)).text.split('\r\n');
    const site = csv.find((l) => l.startsWith('site,'))!.split(',');
    expect(Number(site[3])).toBe(4);
    expect(Number(site[4])).toBe(Number((heatW / 1000).toPrecision(3)));
    expect(Number(site[9])).toBe(cost);
    expect(Number(site[10])).toBeCloseTo(co2t, 1);
  });
});

describe('take-off', () => {
  /*
   * Hand calculation (nominal thicknesses, V = π/4 · (D₂² − D₁²) · L):
   * ST-100, NPS 4 (OD 114.3 mm), 100 m, mineral fibre 50 mm then 40 mm:
   *   layer 1: D₁ = 0.1143 m, D₂ = 0.1143 + 2·0.05 = 0.2143 m → π/4 · (0.04592449 − 0.01306449) · 100 = π/4 · 3.286 = 2.58082 m³
   *   layer 2: D₁ = 0.2143 m, D₂ = 0.2143 + 2·0.04 = 0.2943 m → π/4 · (0.08661249 − 0.04592449) · 100 = π/4 · 4.0688 = 3.19565 m³
   *   outer surface π · 0.2943 · 100 = 92.4568 m²
   * V-10, D 2.0 m, shell 5.0 m, flat heads, board 80 mm:
   *   shell: π/4 · (2.16² − 2.0²) · 5 = π/4 · (4.6656 − 4) · 5 = π/4 · 3.328 = 2.61381 m³
   *   heads: 2 · π · 1.0² · 0.08 = 0.502655 m³ (a flat head's insulation is a slab of the head's area)
   *   total 3.11646 m³; outer surface π · 2.16 · 5 + 2 · π · 1.0² = 33.9292 + 6.28319 = 40.2124 m²
   * Aluminium jacket (ST-100 and V-10): 92.4568 + 40.2124 = 132.669 m² → with 10 % allowance 145.936 m², with 15 % 152.570 m².
   */
  it('when the take-off is read back, then volumes and jacketing match the hand calculation', async () => {
    const csv = (await owner.get(`/api/v1/sites/${siteId}/reports/take-off.csv?revision=${revA.id}&units=SI`).expect(200)).text;
    expect(csv.startsWith('\uFEFF')).toBe(true);
    const rows = Papa.parse<string[]>(csv.slice(1), { newline: '\r\n', skipEmptyLines: true }).data;
    expect(rows[0]).toEqual(['Section', 'Material, finish or size', 'Layer thickness [mm]', 'Count', 'Quantity', 'Unit', 'Note']);
    const volume = (material: string, mm: number) => rows.find((r) => r[0] === 'insulation volume' && r[1].startsWith(material) && Number(r[2]) === mm);
    expect(Number(volume('Mineral-fibre pipe insulation, up to 650', 50)![4])).toBeCloseTo(2.58082, 3);
    expect(Number(volume('Mineral-fibre pipe insulation, up to 650', 40)![4])).toBeCloseTo(3.19565, 3);
    expect(Number(volume('Mineral-fibre board', 80)![4])).toBeCloseTo(3.11646, 3);
    expect(volume('Mineral-fibre board', 80)![5]).toBe('m³');
    const alu = rows.find((r) => r[0] === 'jacketing area' && r[1].startsWith('Aluminium jacket, oxidised'))!;
    expect(Number(alu[3])).toBe(2);
    expect(Number(alu[4])).toBeCloseTo(145.936, 1);
    const counts = (kind: string) => rows.find((r) => r[0] === kind && r[1] === 'NPS 4');
    expect(counts('valves')![4]).toBe('2');
    expect(counts('flanged joints')![4]).toBe('4');
    expect(counts('elbows')![4]).toBe('3');
    expect(counts('tees')![4]).toBe('1');
    expect(rows.find((r) => r[0] === 'valves' && r[1] === 'NPS 1')![4]).toBe('1');

    const wider = (await owner.get(`/api/v1/sites/${siteId}/reports/take-off.csv?revision=${revA.id}&units=SI&overlapPct=15`).expect(200)).text;
    expect(wider).toMatch(/jacketing area,"Aluminium jacket, oxidised or dull \(in service\)",,2,152\.6,m²,outer surface 132\.7 m² plus 15 % overlap allowance\r\n/);

    const { text } = await pdf(owner, `/api/v1/sites/${siteId}/reports/take-off.pdf?revision=${revA.id}&units=SI`);
    expect(text.text).toContain('Mineral-fibre pipe insulation, up to 650 °C 50 mm 1 100.0 m 0 2.581 m³');
    expect(text.text).toContain('Mineral-fibre pipe insulation, up to 650 °C 40 mm 1 100.0 m 0 3.196 m³');
    expect(text.text).toContain('Mineral-fibre board and block insulation, up to 538 °C 80 mm 0 0.0 m 1 3.116 m³');
    expect(text.text).toContain('Aluminium jacket, oxidised or dull (in service) 2 132.7 m² 10 % 145.9 m²');
    expect(text.text).toContain('NPS 4 1 2 4 3 1');
    expect(text.text).toContain('Thicknesses are nominal. Pipe insulation is made to ASTM C585');
    expect(text.text).toContain('1 bare item (no insulation layers) are counted in the fittings only.');
  });

  it('when the take-off is in US units, then volumes are in cubic feet', async () => {
    const { text } = await pdf(owner, `/api/v1/sites/${siteId}/reports/take-off.pdf?revision=${revA.id}&units=US`);
    // 2.58082 m³ ÷ 0.3048³ = 91.14 ft³.
    expect(text.text).toContain('91.14 ft³');
  });
});

describe('every report', () => {
  it('when any report is printed in either unit system, then every character it prints has a glyph in Source Sans 3', async () => {
    for (const report of ['insulation-schedule', 'heat-loss-summary', 'take-off']) {
      for (const units of ['SI', 'US']) {
        for (const revision of [String(revA.id), 'draft']) {
          const { text } = await pdf(owner, `/api/v1/sites/${siteId}/reports/${report}.pdf?revision=${revision}&units=${units}`);
          expect({ report, units, revision, missing: missingGlyphs(text.text) }).toEqual({ report, units, revision, missing: [] });
        }
      }
    }
    // The check itself can fail: a glyph the font lacks is reported.
    expect(missingGlyphs('⚠ ok')).toEqual(['⚠']);
  });

  it('when a schedule runs over many pages, then each page repeats the header row and numbers itself "page n of N"', async () => {
    const big = (await post(owner, '/api/v1/sites', { name: 'Long list', designBases: BASES }).expect(201)).body.site.id;
    for (let i = 1; i <= 90; i++) {
      await post(owner, `/api/v1/sites/${big}/lines`, { tag: `L-${String(i).padStart(3, '0')}`, service: 'Steam', nps: '3', lengthM: 10 + i, operatingTemperatureC: 120 + i, purposes: ['personnelProtection'] }).expect(201);
    }
    await sizeSiteAndWait(owner, big);
    const { text } = await pdf(owner, `/api/v1/sites/${big}/reports/insulation-schedule.pdf?units=SI`);
    expect(text.total).toBeGreaterThanOrEqual(3);
    text.pages.forEach((p, i) => expect(p.text).toContain(`page ${i + 1} of ${text.total}`));
    const withRows = text.pages.filter((p) => /\nL-\d{3} Steam/.test(p.text));
    expect(withRows.length).toBeGreaterThanOrEqual(3);
    for (const p of withRows) expect(p.text).toMatch(/Tag Service Size Temp\. Purposes Gov\. Layers Finish Surface/);
    for (let i = 1; i <= 90; i++) expect(text.text).toContain(`L-${String(i).padStart(3, '0')} Steam NPS 3`);
  });

  it('when the site name is long, then the title block wraps it instead of cutting it off', async () => {
    const name = 'North East Combined Heat and Power Plant, Steam Distribution and Condensate Recovery Areas 3 to 7 (Phase Two)';
    const long = (await post(owner, '/api/v1/sites', { name, designBases: BASES }).expect(201)).body.site.id;
    const { text } = await pdf(owner, `/api/v1/sites/${long}/reports/take-off.pdf`);
    const block = text.pages[0].text.split('REPORT')[0].replace(/\s+/g, ' ');
    expect(block).toContain(name);
  });

  it('when a query is wrong, then 400 names the parameter; another site’s revision is a 404', async () => {
    const base = `/api/v1/sites/${siteId}/reports`;
    const cases: [string, string][] = [
      [`${base}/insulation-schedule.pdf?units=metric`, 'units'],
      [`${base}/insulation-schedule.csv?revision=latest`, 'revision'],
      [`${base}/heat-loss-summary.pdf?overlapPct=10`, 'overlapPct'],
      [`${base}/take-off.csv?overlapPct=150`, 'overlapPct'],
      [`${base}/take-off.csv?overlapPct=-1`, 'overlapPct'],
      [`${base}/take-off.pdf?colour=red`, 'colour'],
    ];
    for (const [path, field] of cases) {
      const res = await owner.get(path).expect(400);
      expect(res.body.errors[0].field).toBe(field);
    }
    const other = (await post(owner, '/api/v1/sites', { name: 'Other works', designBases: BASES }).expect(201)).body.site.id;
    await owner.get(`/api/v1/sites/${other}/reports/insulation-schedule.pdf?revision=${revA.id}`).expect(404);
    await owner.get(`/api/v1/sites/${siteId}/reports/insulation-schedule.pdf?revision=99999`).expect(404);
    const stranger = await signUpOwner(ctx, { teamName: 'Strangers' });
    await stranger.agent.get(`${base}/take-off.csv`).expect(404);
  });
});
