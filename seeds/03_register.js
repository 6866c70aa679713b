// @ts-check
/**
 * Demo hot-surface register for the invented plant of 01_demo.js and 02_line_lists.js: a handful of surfaces
 * found on a plant walk, in every status of the workflow, with the history of how they got there, and photos drawn
 * here with sharp (no real plant, no real camera). Photos go where the server looks for them: UPLOAD_DIR, else
 * .uploads/<environment> (the rule of server/config.ts).
 */
const path = require('node:path');
const sharp = require('sharp');

/**
 * TypeScript modules of the product: through tsx when the knex command runs the seed, through the test
 * runner's own transform when a test does.
 * @param {string} file
 */
function load(file) {
  if (process.env.JEST_WORKER_ID) return require(file);
  return require('tsx/cjs/api').require(file, __filename);
}

/** @type {typeof import('../server/register/photos')} */
const photos = load('../server/register/photos.ts');

const uploadDir =
  process.env.UPLOAD_DIR ||
  path.join(__dirname, '..', '.uploads', process.env.NODE_ENV === 'production' ? 'production' : process.env.NODE_ENV === 'test' ? 'test' : 'development');

const DAY = 86_400_000;

/**
 * A drawn "photo" of a pipe with a flange, in the colours of a hot surface, with a caption.
 * @param {string} caption
 * @param {string} tint
 */
async function drawnPhoto(caption, tint) {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="1280" height="960">
    <defs><linearGradient id="bg" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#5b6770"/><stop offset="1" stop-color="#2b3238"/></linearGradient>
    <linearGradient id="pipe" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#8d8f8f"/><stop offset="0.5" stop-color="${tint}"/><stop offset="1" stop-color="#4a4c4d"/></linearGradient></defs>
    <rect width="1280" height="960" fill="url(#bg)"/>
    <rect x="0" y="380" width="1280" height="200" fill="url(#pipe)"/>
    <rect x="560" y="320" width="70" height="320" rx="8" fill="url(#pipe)" stroke="#222" stroke-width="4"/>
    <rect x="650" y="320" width="70" height="320" rx="8" fill="url(#pipe)" stroke="#222" stroke-width="4"/>
    <rect x="0" y="820" width="1280" height="140" fill="#000" fill-opacity="0.55"/>
    <text x="40" y="900" font-family="sans-serif" font-size="52" fill="#fff">${caption}</text>
  </svg>`;
  return sharp(Buffer.from(svg)).jpeg({ quality: 80 }).toBuffer();
}

/** @param {import('knex').Knex} knex */
exports.seed = async function seed(knex) {
  // Demo photos are named after their content (one file per drawing); earlier uploads of this database go.
  const old = await knex('register_photos').select('file_name', 'thumbnail_name').catch(() => []);
  await knex.raw('SET FOREIGN_KEY_CHECKS = 0');
  try {
    for (const table of ['register_reminders', 'register_photos', 'register_comments', 'register_history', 'register_entries', 'register_settings']) {
      await knex(table).truncate();
    }
  } finally {
    await knex.raw('SET FOREIGN_KEY_CHECKS = 1');
  }
  await photos.removePhotoFiles(
    uploadDir,
    old.flatMap((/** @type {{ file_name: string, thumbnail_name: string }} */ p) => [p.file_name, p.thumbnail_name]),
  );

  const team = await knex('teams').first('id');
  if (!team) return;
  /** @type {Record<string, number>} */
  const people = {};
  for (const m of await knex('memberships').where({ team_id: team.id }).select('user_id', 'role')) people[m.role] = m.user_id;
  /** @type {Record<string, number>} */
  const sites = {};
  for (const s of await knex('sites').where({ team_id: team.id }).select('id', 'name')) sites[s.name] = s.id;
  const now = Date.now();
  const at = (/** @type {number} */ daysAgo, /** @type {number} */ hour = 10) => new Date(Math.floor((now - daysAgo * DAY) / DAY) * DAY + hour * 3_600_000);
  const day = (/** @type {number} */ daysFromNow) => new Date(now + daysFromNow * DAY).toISOString().slice(0, 10);

  // The bare steam accumulator of the boiler house, as the line-list seed sized it.
  const accumulator = await knex('items as i')
    .join('item_results as r', 'r.item_id', 'i.id')
    .where({ 'i.site_id': sites['Boiler house'], 'i.tag': 'V-111' })
    .first('i.id', 'i.input_hash', 'r.surface_temperature_c', 'r.burn_verdict');

  /**
   * @typedef {{ action: string, from?: string | null, to?: string | null, by: number, daysAgo: number, note?: string, changes?: object }} Step
   * @typedef {{ site: string, location: string, description: string, t: number, method: 'contact' | 'infrared' | 'calculated',
   *   emissivity?: number, material: string, finish?: string, reach: boolean, seconds?: number, daysAgo: number,
   *   status: string, action?: string, owner?: number, due?: string, note?: string, closedBy?: number, closedDaysAgo?: number,
   *   verification?: number, item?: { id: number, input_hash: string }, steps: Step[], comments?: [number, number, string][],
   *   photo?: [string, string] }} DemoEntry
   */
  /** @type {DemoEntry[]} */
  const entries = [
    {
      site: 'Boiler house',
      location: 'Feed pump P-101 discharge flange',
      description: 'Bare flange pair at knee height beside the walkway to the boiler front; insulation box missing since the pump overhaul.',
      t: 96,
      method: 'contact',
      material: 'uncoatedMetal',
      finish: 'carbon-steel-oxidised',
      reach: true,
      daysAgo: 2,
      status: 'open',
      steps: [{ action: 'created', to: 'open', by: people.safety, daysAgo: 2 }],
      comments: [[people.engineer, 1, 'A removable flange box for DN 100 is in the store; can fit it on the next shift.']],
      photo: ['P-101 discharge flange, bare', '#c1572b'],
    },
    ...(accumulator && accumulator.burn_verdict === 'fail'
      ? [
          /** @type {DemoEntry} */ ({
            site: 'Boiler house',
            location: 'V-111 steam accumulator shell, ladder side',
            description: 'Uninsulated since the inspection; the fixed ladder to the relief valve runs along the shell.',
            t: Math.round(accumulator.surface_temperature_c * 10) / 10,
            method: 'calculated',
            material: 'uncoatedMetal',
            reach: true,
            daysAgo: 9,
            status: 'actionAssigned',
            action: 'Reinstate 80 mm mineral-fibre insulation with aluminium jacketing on the shell and heads.',
            owner: people.contractor,
            due: day(4),
            item: { id: accumulator.id, input_hash: accumulator.input_hash },
            steps: [
              { action: 'created', to: 'open', by: people.safety, daysAgo: 9 },
              { action: 'assign', from: 'open', to: 'actionAssigned', by: people.safety, daysAgo: 8, note: 'Reinstate 80 mm mineral-fibre insulation with aluminium jacketing on the shell and heads.' },
            ],
          }),
        ]
      : []),
    {
      site: 'Thermal-oil loop',
      location: 'Strainer F-204 cover',
      description: 'Jacketed strainer; reading taken through the gap in the aluminium cover with the thermometer left at 0.95.',
      t: 52,
      method: 'infrared',
      emissivity: 0.95,
      material: 'uncoatedMetal',
      finish: 'aluminium-oxidised',
      reach: true,
      daysAgo: 1,
      status: 'open',
      steps: [{ action: 'created', to: 'open', by: people.safety, daysAgo: 1 }],
    },
    {
      site: 'Tank farm',
      location: 'Bitumen tank TK-301 manway',
      description: 'Manway cover on the roof walkway; regularly stepped over during dipping.',
      t: 88,
      method: 'contact',
      material: 'coatedMetal',
      finish: 'painted-metal',
      reach: true,
      seconds: 10,
      daysAgo: 12,
      status: 'madeSafe',
      action: 'Fit a mesh guard over the manway and mark the hot zone.',
      owner: people.engineer,
      due: day(-1),
      note: 'Mesh guard fitted 50 mm off the cover; hot-surface sign on the handrail.',
      steps: [
        { action: 'created', to: 'open', by: people.safety, daysAgo: 12 },
        { action: 'assign', from: 'open', to: 'actionAssigned', by: people.safety, daysAgo: 11, note: 'Fit a mesh guard over the manway and mark the hot zone.' },
        { action: 'madeSafe', from: 'actionAssigned', to: 'madeSafe', by: people.engineer, daysAgo: 2, note: 'Mesh guard fitted 50 mm off the cover; hot-surface sign on the handrail.' },
      ],
      photo: ['TK-301 manway with the new guard', '#a8632f'],
    },
    {
      site: 'Process unit 2',
      location: 'Reboiler E-402 steam inlet valve bonnet',
      description: 'Valve bonnet above the pipe rack.',
      t: 121,
      method: 'contact',
      material: 'uncoatedMetal',
      reach: false,
      daysAgo: 30,
      status: 'accepted',
      note: 'Above the pipe rack, reached only under a permit with the line isolated and cooled.',
      closedBy: people.safety,
      closedDaysAgo: 29,
      steps: [
        { action: 'created', to: 'open', by: people.safety, daysAgo: 30 },
        { action: 'accept', from: 'open', to: 'accepted', by: people.safety, daysAgo: 29, note: 'Above the pipe rack, reached only under a permit with the line isolated and cooled.' },
      ],
    },
    {
      site: 'Chilled water',
      location: 'Glycol header drain valve at the chiller',
      description: 'Frosted valve body at hand height; insulation cut back for the drain.',
      t: -18,
      method: 'contact',
      material: 'uncoatedMetal',
      reach: true,
      daysAgo: 3,
      status: 'open',
      steps: [{ action: 'created', to: 'open', by: people.safety, daysAgo: 3 }],
    },
    {
      site: 'Boiler house',
      location: 'Blowdown vessel V-103 drain line at the sample point',
      description: 'Short bare run where operators take boiler-water samples.',
      t: 74,
      method: 'contact',
      material: 'uncoatedMetal',
      reach: true,
      daysAgo: 40,
      status: 'verified',
      action: 'Insulate the drain run and fit a finger guard at the sample valve.',
      owner: people.engineer,
      due: day(-30),
      note: 'Checked on the walk: guard secure, jacket surface 38 °C.',
      closedBy: people.safety,
      closedDaysAgo: 26,
      verification: 38,
      steps: [
        { action: 'created', to: 'open', by: people.safety, daysAgo: 40 },
        { action: 'assign', from: 'open', to: 'actionAssigned', by: people.safety, daysAgo: 39, note: 'Insulate the drain run and fit a finger guard at the sample valve.' },
        { action: 'madeSafe', from: 'actionAssigned', to: 'madeSafe', by: people.engineer, daysAgo: 28, note: 'Insulated with 40 mm pipe sections and a finger guard.' },
        { action: 'verify', from: 'madeSafe', to: 'verified', by: people.safety, daysAgo: 26, note: 'Checked on the walk: guard secure, jacket surface 38 °C.' },
      ],
      photo: ['V-103 drain, insulated and guarded', '#8a8f93'],
    },
  ];

  for (const e of entries) {
    const siteId = sites[e.site];
    if (!siteId) continue;
    const [id] = await knex('register_entries').insert({
      team_id: team.id,
      site_id: siteId,
      item_id: e.item?.id ?? null,
      item_input_hash: e.item?.input_hash ?? null,
      location: e.location,
      description: e.description,
      measured_temperature_c: e.t,
      method: e.method,
      emissivity_setting: e.emissivity ?? null,
      surface_material: e.material,
      surface_finish_id: e.finish ?? null,
      within_reach: e.reach,
      contact_seconds: e.seconds ?? null,
      measured_at: at(e.daysAgo, 9),
      status: e.status,
      action: e.action ?? '',
      owner_user_id: e.owner ?? null,
      due_date: e.due ?? null,
      assigned_by: e.owner ? people.safety : null,
      status_note: e.note ?? '',
      closed_by: e.closedBy ?? null,
      closed_at: e.closedDaysAgo === undefined ? null : at(e.closedDaysAgo, 15),
      verification_temperature_c: e.verification ?? null,
      created_by: people.safety,
      updated_by: e.steps[e.steps.length - 1].by,
      created_at: at(e.daysAgo, 9),
      updated_at: at(e.steps[e.steps.length - 1].daysAgo, 14),
    });
    for (const s of e.steps) {
      await knex('register_history').insert({
        entry_id: id,
        team_id: team.id,
        user_id: s.by,
        action: s.action,
        from_status: s.from ?? null,
        to_status: s.to ?? null,
        changes: JSON.stringify(s.action === 'assign' ? { ownerUserId: { from: null, to: e.owner }, dueDate: { from: null, to: e.due } } : {}),
        note: s.note ?? '',
        created_at: at(s.daysAgo, s.action === 'created' ? 9 : 14),
      });
    }
    for (const [by, daysAgo, body] of e.comments ?? []) {
      await knex('register_comments').insert({ entry_id: id, team_id: team.id, user_id: by, body, created_at: at(daysAgo, 11) });
    }
    if (e.photo) {
      const processed = await photos.processPhoto(await drawnPhoto(e.photo[0], e.photo[1]), { name: 'demo.jpg', field: 'photos[0]', keepLocation: false });
      const stored = await photos.writePhotoFiles(uploadDir, processed, { byContent: true });
      await knex('register_photos').insert({
        entry_id: id,
        team_id: team.id,
        file_name: stored.fileName,
        thumbnail_name: stored.thumbnailName,
        content_type: 'image/jpeg',
        width: processed.width,
        height: processed.height,
        bytes: processed.image.length,
        original_type: processed.originalType,
        original_width: processed.originalWidth,
        original_height: processed.originalHeight,
        taken_at: at(e.daysAgo, 9),
        uploaded_by: people.safety,
        created_at: at(e.daysAgo, 9),
      });
      await knex('register_history').insert({
        entry_id: id,
        team_id: team.id,
        user_id: people.safety,
        action: 'photoAdded',
        changes: '{}',
        note: '1 photo',
        created_at: at(e.daysAgo, 9),
      });
    }
  }
};
