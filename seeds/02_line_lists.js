// @ts-check
/**
 * Demo line lists for the invented plant of 01_demo.js: a few hundred lines and about a dozen vessels per
 * site, with every purpose, some existing insulation that falls short, some bare items, and one team material
 * from an (invented) supplier datasheet. Everything is sized here, with the same code the server's job runs.
 * The numbers are generated from a fixed seed, so every demo is the same.
 */
/**
 * TypeScript modules of the product: through tsx when the knex command runs the seed, through the test
 * runner's own transform when a test does.
 * @param {string} file
 */
function load(file) {
  if (process.env.JEST_WORKER_ID) return require(file);
  return require('tsx/cjs/api').require(file, __filename);
}

/** @type {typeof import('../shared/calc/sizing')} */
const sizing = load('../shared/calc/sizing/index.ts');
/** @type {typeof import('../shared/calc/pipe-sizes')} */
const pipes = load('../shared/calc/pipe-sizes.ts');
/** @type {typeof import('../server/lines/items.repository')} */
const items = load('../server/lines/items.repository.ts');

/** Deterministic pseudo-random numbers (mulberry32). */
function random(seed) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Services per site: [code, name, temperature °C, purposes, count, NPS choices, extras].
 * @typedef {{ code: string, name: string, t: number, purposes: string[], count: number, nps: string[],
 *   holding?: { massFlowKgPerS: number, specificHeatJPerKgK: number, maxChangeK: number },
 *   frost?: { minHours: number, startTemperatureC: number }, heatLimit?: number }} Service
 */
/** @type {Record<string, Service[]>} */
const SERVICES = {
  'Boiler house': [
    { code: 'HS', name: 'HP steam 12 bar(g)', t: 192, purposes: ['personnelProtection', 'heatConservation'], count: 60, nps: ['2', '3', '4', '6', '8', '10'] },
    { code: 'LS', name: 'LP steam 3.5 bar(g)', t: 148, purposes: ['personnelProtection', 'heatConservation'], count: 50, nps: ['1', '1-1/2', '2', '3', '4'] },
    { code: 'CR', name: 'Condensate return', t: 95, purposes: ['personnelProtection', 'heatConservation'], count: 55, nps: ['3/4', '1', '1-1/2', '2', '3'] },
    { code: 'FW', name: 'Boiler feed water', t: 105, purposes: ['personnelProtection', 'heatConservation'], count: 30, nps: ['1-1/2', '2', '3', '4'] },
    { code: 'BD', name: 'Blowdown', t: 190, purposes: ['personnelProtection'], count: 15, nps: ['1', '1-1/2', '2'] },
  ],
  'Thermal-oil loop': [
    { code: 'TOS', name: 'Thermal oil supply', t: 290, purposes: ['personnelProtection', 'heatConservation'], count: 70, nps: ['2', '3', '4', '6', '8'] },
    { code: 'TOR', name: 'Thermal oil return', t: 250, purposes: ['personnelProtection', 'heatConservation'], count: 70, nps: ['2', '3', '4', '6', '8'] },
    {
      code: 'TOJ',
      name: 'Jacket feed to reactors',
      t: 280,
      purposes: ['personnelProtection', 'temperatureHolding'],
      count: 25,
      nps: ['2', '3', '4'],
      holding: { massFlowKgPerS: 1.2, specificHeatJPerKgK: 2500, maxChangeK: 3 },
    },
    { code: 'TOV', name: 'Vents and drains', t: 260, purposes: ['personnelProtection'], count: 40, nps: ['3/4', '1', '1-1/2'] },
  ],
  'Tank farm': [
    { code: 'HFO', name: 'Heavy fuel oil transfer', t: 85, purposes: ['heatConservation'], count: 60, nps: ['3', '4', '6', '8'] },
    { code: 'BIT', name: 'Bitumen', t: 180, purposes: ['personnelProtection', 'heatConservation'], count: 45, nps: ['3', '4', '6'] },
    { code: 'STR', name: 'Steam to tank heaters', t: 160, purposes: ['personnelProtection', 'heatConservation'], count: 45, nps: ['1', '1-1/2', '2', '3'] },
    {
      code: 'FWS',
      name: 'Fire water (standing)',
      t: 10,
      purposes: ['frostProtection'],
      count: 35,
      nps: ['4', '6', '8', '10'],
      frost: { minHours: 12, startTemperatureC: 8 },
    },
    {
      code: 'UW',
      name: 'Utility water',
      t: 12,
      purposes: ['frostProtection'],
      count: 25,
      nps: ['1', '1-1/2', '2'],
      frost: { minHours: 6, startTemperatureC: 10 },
    },
  ],
  'Process unit 2': [
    { code: 'OVH', name: 'Column overhead vapour', t: 120, purposes: ['personnelProtection', 'heatConservation'], count: 40, nps: ['6', '8', '10', '12'] },
    { code: 'BTM', name: 'Column bottoms', t: 245, purposes: ['personnelProtection', 'heatConservation'], count: 45, nps: ['3', '4', '6'] },
    { code: 'RB', name: 'Reboiler steam', t: 175, purposes: ['personnelProtection', 'heatConservation'], count: 40, nps: ['2', '3', '4', '6'] },
    { code: 'PR', name: 'Propane refrigerant', t: -38, purposes: ['condensationControl'], count: 45, nps: ['1', '1-1/2', '2', '3', '4'] },
    {
      code: 'CW',
      name: 'Cooling water',
      t: 24,
      purposes: ['frostProtection'],
      count: 35,
      nps: ['4', '6', '8'],
      frost: { minHours: 8, startTemperatureC: 20 },
    },
    { code: 'FL', name: 'Flare header (hot)', t: 150, purposes: ['personnelProtection'], count: 20, nps: ['8', '10', '12'] },
  ],
  'Chilled water': [
    { code: 'CHS', name: 'Chilled water supply 6 °C', t: 6, purposes: ['condensationControl'], count: 90, nps: ['1', '1-1/2', '2', '3', '4', '6', '8'] },
    { code: 'CHR', name: 'Chilled water return 12 °C', t: 12, purposes: ['condensationControl'], count: 90, nps: ['1', '1-1/2', '2', '3', '4', '6', '8'] },
    { code: 'GLY', name: 'Glycol brine −10 °C', t: -10, purposes: ['condensationControl'], count: 30, nps: ['1', '1-1/2', '2', '3'] },
  ],
};

/** Vessels per site: [tag, service, diameter m, length m, orientation, head, temperature °C, purposes]. */
/** @type {Record<string, [string, string, number, number, 'horizontal' | 'vertical', string, number, string[]][]>} */
const VESSELS = {
  'Boiler house': [
    ['D-101', 'Deaerator', 2.2, 6, 'horizontal', 'ellipsoidal2to1', 105, ['personnelProtection', 'heatConservation']],
    ['TK-102', 'Condensate receiver', 1.6, 3, 'vertical', 'ellipsoidal2to1', 95, ['personnelProtection', 'heatConservation']],
    ['V-103', 'Blowdown vessel', 1.0, 1.8, 'vertical', 'hemispherical', 150, ['personnelProtection']],
    ['V-104', 'Flash vessel', 0.9, 2.0, 'vertical', 'ellipsoidal2to1', 140, ['personnelProtection', 'heatConservation']],
    ['V-105', 'Steam header drum', 0.8, 5.0, 'horizontal', 'hemispherical', 192, ['personnelProtection', 'heatConservation']],
    ['TK-106', 'Chemical dosing tank', 1.0, 1.5, 'vertical', 'flat', 45, ['heatConservation']],
    ['V-107', 'Sample cooler shell', 0.4, 1.2, 'horizontal', 'flat', 120, ['personnelProtection']],
    ['V-108', 'Economiser drain pot', 0.5, 1.0, 'vertical', 'ellipsoidal2to1', 180, ['personnelProtection']],
    ['V-109', 'Feedwater heater shell', 1.1, 4.5, 'horizontal', 'ellipsoidal2to1', 160, ['personnelProtection', 'heatConservation']],
    ['TK-110', 'Hot well', 2.0, 2.5, 'vertical', 'flat', 85, ['heatConservation']],
    ['V-111', 'Steam accumulator', 2.8, 9.0, 'horizontal', 'ellipsoidal2to1', 185, ['personnelProtection', 'heatConservation']],
    ['V-112', 'Vent condenser', 0.6, 1.4, 'vertical', 'ellipsoidal2to1', 100, ['personnelProtection']],
  ],
  'Thermal-oil loop': [
    ['TK-201', 'Thermal oil expansion tank', 1.8, 4.0, 'horizontal', 'ellipsoidal2to1', 180, ['personnelProtection', 'heatConservation']],
    ['TK-202', 'Thermal oil drain tank', 2.0, 5.0, 'horizontal', 'ellipsoidal2to1', 120, ['personnelProtection', 'heatConservation']],
    ['V-203', 'Deaerating pot', 0.8, 1.8, 'vertical', 'ellipsoidal2to1', 290, ['personnelProtection', 'heatConservation']],
    ['F-204', 'Strainer housing', 0.5, 0.9, 'vertical', 'flat', 290, ['personnelProtection']],
    ['V-205', 'Heater outlet manifold', 0.6, 3.0, 'horizontal', 'hemispherical', 290, ['personnelProtection', 'heatConservation']],
    ['V-206', 'Return header drum', 0.6, 3.0, 'horizontal', 'hemispherical', 250, ['personnelProtection', 'heatConservation']],
    ['V-207', 'Cold seal pot', 0.7, 1.2, 'vertical', 'ellipsoidal2to1', 60, ['heatConservation']],
    ['V-208', 'Jacket distribution drum', 0.9, 2.5, 'horizontal', 'ellipsoidal2to1', 280, ['personnelProtection', 'heatConservation']],
    ['V-209', 'Pump suction drum', 0.8, 2.0, 'vertical', 'ellipsoidal2to1', 250, ['personnelProtection']],
    ['V-210', 'Filter housing', 0.6, 1.5, 'vertical', 'ellipsoidal2to1', 250, ['personnelProtection']],
  ],
  'Tank farm': [
    ['TK-301', 'Heavy fuel oil storage', 14, 12, 'vertical', 'flat', 60, ['heatConservation']],
    ['TK-302', 'Heavy fuel oil storage', 14, 12, 'vertical', 'flat', 60, ['heatConservation']],
    ['TK-303', 'Bitumen storage', 10, 10, 'vertical', 'flat', 170, ['personnelProtection', 'heatConservation']],
    ['TK-304', 'Bitumen storage', 10, 10, 'vertical', 'flat', 170, ['personnelProtection', 'heatConservation']],
    ['TK-305', 'Heavy fuel oil day tank', 4, 6, 'vertical', 'flat', 90, ['personnelProtection', 'heatConservation']],
    ['TK-306', 'Slop oil tank', 6, 8, 'vertical', 'flat', 45, ['heatConservation']],
    ['V-307', 'Steam trap manifold pot', 0.5, 1.0, 'vertical', 'ellipsoidal2to1', 160, ['personnelProtection']],
    ['TK-308', 'Fire water tank', 12, 10, 'vertical', 'flat', 8, ['condensationControl']],
    ['V-309', 'Transfer pump strainer', 0.5, 0.8, 'vertical', 'flat', 85, ['personnelProtection']],
    ['TK-310', 'Bitumen loading tank', 3, 5, 'horizontal', 'ellipsoidal2to1', 180, ['personnelProtection', 'heatConservation']],
    ['TK-311', 'Fuel oil settling tank', 5, 7, 'vertical', 'flat', 75, ['heatConservation']],
    ['TK-312', 'Condensate collection tank', 2, 3, 'horizontal', 'ellipsoidal2to1', 90, ['personnelProtection', 'heatConservation']],
  ],
  'Process unit 2': [
    ['C-401', 'Distillation column', 2.4, 28, 'vertical', 'ellipsoidal2to1', 160, ['personnelProtection', 'heatConservation']],
    ['E-402', 'Reboiler shell', 1.2, 6, 'horizontal', 'ellipsoidal2to1', 200, ['personnelProtection', 'heatConservation']],
    ['V-403', 'Reflux drum', 1.6, 5, 'horizontal', 'ellipsoidal2to1', 45, ['heatConservation']],
    ['V-404', 'Propane accumulator', 1.4, 4.5, 'horizontal', 'hemispherical', -38, ['condensationControl']],
    ['V-405', 'Refrigerant suction drum', 1.0, 2.5, 'vertical', 'ellipsoidal2to1', -40, ['condensationControl']],
    ['C-406', 'Stripper', 1.2, 16, 'vertical', 'ellipsoidal2to1', 180, ['personnelProtection', 'heatConservation']],
    ['V-407', 'Bottoms surge drum', 1.8, 5.5, 'horizontal', 'ellipsoidal2to1', 240, ['personnelProtection', 'heatConservation']],
    ['V-408', 'Knock-out drum', 2.2, 6, 'horizontal', 'ellipsoidal2to1', 150, ['personnelProtection']],
    ['E-409', 'Feed preheater shell', 0.9, 5, 'horizontal', 'ellipsoidal2to1', 210, ['personnelProtection', 'heatConservation']],
    ['V-410', 'Chiller economiser', 0.8, 2.0, 'vertical', 'ellipsoidal2to1', -20, ['condensationControl']],
    ['V-411', 'Flare knock-out drum', 3.0, 9, 'horizontal', 'ellipsoidal2to1', 140, ['personnelProtection']],
    ['V-412', 'Solvent recovery drum', 1.2, 3.5, 'horizontal', 'ellipsoidal2to1', 110, ['personnelProtection', 'heatConservation']],
  ],
  'Chilled water': [
    ['TK-501', 'Chilled water buffer tank', 2.0, 4.0, 'vertical', 'ellipsoidal2to1', 6, ['condensationControl']],
    ['E-502', 'Chiller 1 evaporator shell', 1.0, 3.5, 'horizontal', 'ellipsoidal2to1', 5, ['condensationControl']],
    ['E-503', 'Chiller 2 evaporator shell', 1.0, 3.5, 'horizontal', 'ellipsoidal2to1', 5, ['condensationControl']],
    ['V-504', 'Air separator', 0.6, 1.2, 'vertical', 'ellipsoidal2to1', 6, ['condensationControl']],
    ['V-505', 'Expansion vessel', 0.8, 1.5, 'vertical', 'hemispherical', 10, ['condensationControl']],
    ['TK-506', 'Glycol make-up tank', 1.2, 1.8, 'vertical', 'flat', -10, ['condensationControl']],
    ['E-507', 'Plate-frame header box', 0.5, 1.0, 'horizontal', 'flat', 6, ['condensationControl']],
    ['V-508', 'Return header drum', 0.7, 3.0, 'horizontal', 'hemispherical', 12, ['condensationControl']],
    ['V-509', 'Supply header drum', 0.7, 3.0, 'horizontal', 'hemispherical', 6, ['condensationControl']],
    ['TK-510', 'Glycol storage tank', 1.8, 2.5, 'vertical', 'flat', -10, ['condensationControl']],
    ['V-511', 'Dirt separator', 0.5, 1.0, 'vertical', 'ellipsoidal2to1', 6, ['condensationControl']],
    ['V-512', 'Chilled water pump strainer', 0.4, 0.8, 'vertical', 'flat', 6, ['condensationControl']],
  ],
};

/** An invented supplier datasheet for the demo's team material (no real product). */
const TEAM_MATERIAL = {
  name: 'Flexible aerogel blanket, supplier grade AV-10',
  source: 'Supplier datasheet AV-10, revision C, table 2 (invented for the demo)',
  // Mean temperature °C → k W/(m·K), as the datasheet would tabulate them.
  tablePoints: [
    { meanTemperatureC: 0, conductivityWPerMK: 0.0175 },
    { meanTemperatureC: 100, conductivityWPerMK: 0.0205 },
    { meanTemperatureC: 200, conductivityWPerMK: 0.0255 },
    { meanTemperatureC: 300, conductivityWPerMK: 0.0325 },
    { meanTemperatureC: 400, conductivityWPerMK: 0.0415 },
  ],
  maxServiceTemperatureC: 650,
  minServiceTemperatureC: -40,
};

const RESET = ['jobs', 'item_results', 'items', 'team_finishes', 'team_materials'];

/** @param {import('knex').Knex} knex */
exports.seed = async function seed(knex) {
  await knex.raw('SET FOREIGN_KEY_CHECKS = 0');
  try {
    for (const table of RESET) await knex(table).truncate();
  } finally {
    await knex.raw('SET FOREIGN_KEY_CHECKS = 1');
  }
  const team = await knex('teams').first('id');
  const engineer = await knex('memberships').where({ team_id: team.id, role: 'engineer' }).first('user_id');
  const userId = engineer?.user_id ?? null;

  const fit = sizing.fitTeamConductivity(TEAM_MATERIAL.tablePoints, [TEAM_MATERIAL.minServiceTemperatureC, TEAM_MATERIAL.maxServiceTemperatureC]);
  const [materialId] = await knex('team_materials').insert({
    team_id: team.id,
    name: TEAM_MATERIAL.name,
    source: TEAM_MATERIAL.source,
    table_points: JSON.stringify(TEAM_MATERIAL.tablePoints),
    conductivity: JSON.stringify(fit.conductivity),
    fit_max_error_pct: fit.maxErrorPct,
    max_service_temperature_c: TEAM_MATERIAL.maxServiceTemperatureC,
    min_service_temperature_c: TEAM_MATERIAL.minServiceTemperatureC,
    notes: 'Used on the thermal-oil loop where space is tight.',
    created_by: userId,
  });
  const teamMaterial = {
    id: `team-material-${materialId}`,
    name: TEAM_MATERIAL.name,
    conductivity: fit.conductivity,
    maxServiceTemperatureC: TEAM_MATERIAL.maxServiceTemperatureC,
    minServiceTemperatureC: TEAM_MATERIAL.minServiceTemperatureC,
    conductivityDataRangeC: fit.dataRangeC,
  };
  const library = sizing.sizingLibrary({ materials: [teamMaterial] });

  const rnd = random(20261203);
  const pick = (/** @type {any[]} */ xs) => xs[Math.floor(rnd() * xs.length)];
  const sites = await knex('sites').where({ team_id: team.id }).orderBy('id');
  for (const site of sites) {
    const services = SERVICES[site.name] ?? [];
    const bases = typeof site.design_bases === 'string' ? JSON.parse(site.design_bases) : site.design_bases;
    // The process unit's cold service is applied in layers of up to 150 mm (cellular glass), the others' 100 mm.
    const stored = site.name === 'Process unit 2' ? { ...sizing.DEFAULT_SIZING_SETTINGS, maxSingleLayerMm: 150 } : null;
    if (stored) await knex('sites').where({ id: site.id }).update({ sizing_settings: JSON.stringify(stored) });
    const ctx = { bases, settings: sizing.toSizingSettings(stored), library };
    const indoor = site.name === 'Boiler house' || site.name === 'Chilled water';
    /** @type {{ write: any, task: import('../shared/calc/sizing').SizingTask }[]} */
    const rows = [];
    let serial = 1000 + site.id * 1000;
    for (const s of services) {
      for (let i = 0; i < s.count; i++) {
        const nps = pick(s.nps);
        const size = pipes.pipeSizeByNps(nps);
        const vertical = rnd() < 0.12;
        const lengthM = Math.round((vertical ? 3 + rnd() * 12 : 4 + rnd() * 120) * 10) / 10;
        const near = rnd();
        /** @type {string[]} */
        const purposes = [...s.purposes];
        // Lines away from walkways do not need personnel protection.
        if (purposes.includes('personnelProtection') && purposes.length > 1 && near > 0.7) purposes.splice(purposes.indexOf('personnelProtection'), 1);
        /** @type {Record<string, unknown>} */
        const params = {};
        if (s.holding) params.temperatureHolding = s.holding;
        if (s.frost) params.frostProtection = s.frost;
        // A few lines carry the client's own heat-loss limit: about 0.6 W/m per millimetre of pipe diameter.
        if (purposes.includes('heatConservation') && rnd() < 0.08) params.heatConservation = { maxHeatLossWPerM: Math.round(0.6 * size.outerDiameterMm) };
        /** @type {import('../shared/calc/sizing').BuildUp | null} */
        let buildUp = null;
        let notes = '';
        const fate = rnd();
        if (fate < 0.04) {
          buildUp = { layers: [], finishId: 'carbon-steel-oxidised', fixed: true };
          notes = 'Bare: insulation removed for a repair and not replaced.';
        } else if (fate < 0.09 && s.t > 40) {
          buildUp = { layers: [{ materialId: 'mineral-fibre-pipe-c547-type-i', thicknessM: 0.025 }], finishId: 'aluminium-oxidised', fixed: true };
          notes = 'Existing 25 mm insulation, to be checked.';
        } else if (site.name === 'Thermal-oil loop' && fate < 0.3) {
          buildUp = { layers: [{ materialId: teamMaterial.id }], finishId: 'aluminium-oxidised' };
        } else if (s.t >= 300) {
          buildUp = { layers: [{ materialId: 'calcium-silicate-c533-type-i' }], finishId: 'aluminium-oxidised' };
        } else if (s.t < -20) {
          buildUp = { layers: [{ materialId: 'cellular-glass-c552-grade-6' }], finishId: 'mastic-or-canvas' };
        }
        const item = {
          kind: /** @type {'line'} */ ('line'),
          outerDiameterM: Number((size.outerDiameterMm / 1000).toPrecision(12)),
          nps: size.nps,
          lengthM,
          orientation: /** @type {'horizontal' | 'vertical'} */ (vertical ? 'vertical' : 'horizontal'),
          heightM: vertical ? lengthM : null,
          headType: null,
          location: /** @type {'indoor' | 'outdoor'} */ (indoor ? 'indoor' : 'outdoor'),
          operatingTemperatureC: s.t,
          purposes: /** @type {any} */ (sizing.PURPOSES.filter((p) => purposes.includes(p))),
          purposeParameters: params,
          fittings: { valves: Math.floor(rnd() * 4), flanges: Math.floor(rnd() * 6), elbows: Math.floor(rnd() * 8), tees: Math.floor(rnd() * 3) },
          fittingsInsulated: rnd() > 0.15,
        };
        const tag = `${size.nps}"-${s.code}-${serial++}`;
        rows.push({
          task: { item, buildUp },
          write: {
            ...item,
            tag,
            service: s.name,
            sizeKind: rnd() < 0.2 ? 'dn' : 'nps',
            dn: size.dn,
            buildUp,
            notes,
            inputHash: '',
          },
        });
      }
    }
    for (const [tag, service, d, l, orientation, head, t, purposes] of VESSELS[site.name] ?? []) {
      const item = {
        kind: /** @type {'vessel'} */ ('vessel'),
        outerDiameterM: d,
        nps: null,
        lengthM: l,
        orientation,
        heightM: null,
        headType: /** @type {any} */ (head),
        location: /** @type {'indoor' | 'outdoor'} */ (indoor ? 'indoor' : 'outdoor'),
        operatingTemperatureC: t,
        purposes: /** @type {any} */ (sizing.PURPOSES.filter((p) => purposes.includes(p))),
        purposeParameters: {},
        fittings: { valves: 0, flanges: 0, elbows: 0, tees: 0 },
        fittingsInsulated: true,
      };
      const bare = tag === 'TK-306' || tag === 'V-307' || tag === 'V-111';
      const buildUp = bare
        ? { layers: [], finishId: 'carbon-steel-oxidised', fixed: true }
        : t < -20
          ? { layers: [{ materialId: 'cellular-glass-c552-grade-6' }], finishId: 'mastic-or-canvas' }
          : d > 3
            ? { layers: [{ materialId: 'mineral-fibre-board-c612-type-iva' }], finishId: 'galvanised-steel-weathered' }
            : null;
      rows.push({
        task: { item, buildUp },
        write: {
          ...item,
          tag,
          service,
          sizeKind: null,
          dn: null,
          buildUp,
          notes: bare ? 'Bare: reported by the safety walk, awaiting insulation.' : '',
          inputHash: '',
        },
      });
    }
    const sized = sizing.sizeItems(ctx, rows.map((r) => r.task));
    const insertRows = rows.map((r, k) => items.itemInsertRow(team.id, site.id, r.task.item.kind, userId, { ...r.write, inputHash: sized[k].inputHash }));
    for (let k = 0; k < insertRows.length; k += 200) await knex('items').insert(insertRows.slice(k, k + 200));
    const ids = await knex('items').where({ site_id: site.id }).orderBy('id').select('id', 'tag', 'kind');
    const idOf = new Map(ids.map((/** @type {{ id: number, tag: string, kind: string }} */ r) => [`${r.kind}:${r.tag}`, r.id]));
    const sizedAt = new Date();
    await items.upsertResults(
      knex,
      rows.map((r, k) => ({ itemId: /** @type {number} */ (idOf.get(`${r.task.item.kind}:${r.write.tag}`)), siteId: site.id, inputHash: sized[k].inputHash, result: sized[k].result, sizedAt })),
    );
  }
};
