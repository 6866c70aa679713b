/**
 * Benchmark: the insulation schedule of a 10,000-line list rendered to PDF (document built and rendered,
 * fonts embedded), from a seeded synthetic list — no database, the layout is what is timed.
 * Prints one JSON object: { schedulePdf10kS (wall), schedulePdf10kCpuS (this process's CPU), pages, bytes, items }.
 */
import { performance } from 'node:perf_hooks';
import { DEFAULT_SIZING_SETTINGS } from '../shared/calc/sizing/settings';
import type { ItemSizing, Purpose } from '../shared/calc/sizing/types';
import { displayUnits } from '../server/reports/display';
import { renderPdf } from '../server/reports/pdf';
import { insulationScheduleDocument } from '../server/reports/schedule';
import type { LineList } from '../server/revisions/revisions.service';
import type { ListedItem } from '../server/revisions/snapshot';
import { seededRandom } from './bench-cases';

const COUNT = Number(process.argv[2] ?? 10_000);

function syntheticList(count: number): LineList {
  const rnd = seededRandom(10_000);
  const sizes: [string, number][] = [
    ['1', 0.0334],
    ['2', 0.0603],
    ['3', 0.0889],
    ['4', 0.1143],
    ['6', 0.1683],
    ['8', 0.2191],
  ];
  const services = ['HP steam 12 bar(g)', 'LP steam', 'Condensate return', 'Thermal oil supply', 'Boiler feed water'];
  const items: ListedItem[] = [];
  for (let i = 0; i < count; i++) {
    const [nps, od] = sizes[Math.floor(rnd() * sizes.length)];
    const t = Math.round(80 + rnd() * 220);
    const purposes: Purpose[] = rnd() < 0.6 ? ['personnelProtection', 'heatConservation'] : ['personnelProtection'];
    const layers = t > 250 ? [0.06, 0.05] : [[0.03, 0.04, 0.05][Math.floor(rnd() * 3)]];
    const total = layers.reduce((s, x) => s + x, 0);
    const q = 20 + rnd() * 150;
    const length = Math.round(5 + rnd() * 120);
    const result = {
      service: 'hot',
      buildUpSource: 'siteDefault',
      purposes: [],
      governingPurpose: purposes[purposes.length - 1],
      layers: layers.map((thicknessM) => ({ materialId: 'mineral-fibre-pipe-c547-type-ii', thicknessM })),
      layersM: layers,
      totalThicknessM: total,
      finishId: 'aluminium-oxidised',
      heatLossWPerM: q,
      bareHeatLossWPerM: q * 9,
      heatLossW: q * length,
      bareHeatLossW: q * 9 * length,
      surfaceTemperatureC: 40 + rnd() * 19,
      surfaceBasis: 'touch',
      burnVerdict: 'pass',
      annualEnergyKWh: (q * length * 8000) / 1000,
      bareAnnualEnergyKWh: (q * 9 * length * 8000) / 1000,
      failing: [],
      evaluations: [],
      warnings: [],
    } as ItemSizing;
    items.push({
      item: {
        itemId: i + 1,
        kind: 'line',
        tag: `${['HS', 'LS', 'CR', 'TO', 'FW'][i % 5]}-${String(i + 1).padStart(5, '0')}`,
        service: services[i % services.length],
        sizeKind: 'nps',
        nps,
        dn: null,
        outerDiameterM: od,
        lengthM: length,
        orientation: 'horizontal',
        heightM: null,
        headType: null,
        location: rnd() < 0.5 ? 'indoor' : 'outdoor',
        operatingTemperatureC: t,
        purposes,
        purposeParameters: {},
        fittings: { valves: Math.floor(rnd() * 3), flanges: Math.floor(rnd() * 4), elbows: 0, tees: 0 },
        fittingsInsulated: true,
        buildUp: null,
        notes: '',
        inputHash: '0000000000000000',
      },
      result,
      status: 'current',
      sizedAt: '2026-12-03T10:00:00.000Z',
    });
  }
  return {
    revision: null,
    snapshot: {
      site: { id: 1, name: 'Benchmark works', description: '' },
      designBases: { touch: { airTemperatureC: 35 }, energy: { airTemperatureC: 10, windSpeedMS: 3, operatingHoursPerYear: 8000 } },
      sizingSettings: DEFAULT_SIZING_SETTINGS,
      library: {
        materials: [{ id: 'mineral-fibre-pipe-c547-type-ii', name: 'Mineral-fibre pipe insulation, up to 650 °C' }],
        finishes: [{ id: 'aluminium-oxidised', name: 'Aluminium jacket, oxidised or dull (in service)' }],
      },
    },
    items,
  };
}

async function main() {
  const list = syntheticList(COUNT);
  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  const doc = insulationScheduleDocument(list, displayUnits('SI'), new Date('2026-12-03T12:00:00Z'));
  const pdf = await renderPdf(doc);
  const seconds = (performance.now() - t0) / 1000;
  const cpu = process.cpuUsage(cpu0);
  const cpuSeconds = (cpu.user + cpu.system) / 1e6;
  const pages = (pdf.toString('latin1').match(/\/Type \/Page\b/g) ?? []).length;
  process.stdout.write(`${JSON.stringify({ schedulePdf10kS: Number(seconds.toFixed(2)), schedulePdf10kCpuS: Number(cpuSeconds.toFixed(2)), items: COUNT, pages, bytes: pdf.length })}\n`);
}

main().catch((e) => {
  process.stderr.write(String(e?.stack ?? e));
  process.exit(1);
});
