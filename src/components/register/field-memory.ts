/**
 * What a field entry remembers between walks on this device (web local storage): the last site, how the
 * last reading was taken and the thermometer's emissivity setting. Nothing is kept when storage is not there.
 */
export type FieldMemory = { siteId?: string; method?: 'contact' | 'infrared'; emissivitySetting?: number };

const KEY = 'lagline.register.field';

function storage(): Storage | null {
  try {
    return typeof window !== 'undefined' && window.localStorage ? window.localStorage : null;
  } catch {
    return null;
  }
}

export function readFieldMemory(): FieldMemory {
  const s = storage();
  if (!s) return {};
  try {
    const v = JSON.parse(s.getItem(KEY) ?? '{}') as Record<string, unknown>;
    const out: FieldMemory = {};
    if (typeof v.siteId === 'string' && /^\d+$/.test(v.siteId)) out.siteId = v.siteId;
    if (v.method === 'contact' || v.method === 'infrared') out.method = v.method;
    if (typeof v.emissivitySetting === 'number' && v.emissivitySetting > 0 && v.emissivitySetting <= 1) out.emissivitySetting = v.emissivitySetting;
    return out;
  } catch {
    return {};
  }
}

export function rememberField(patch: FieldMemory): void {
  const s = storage();
  if (!s) return;
  try {
    s.setItem(KEY, JSON.stringify({ ...readFieldMemory(), ...patch }));
  } catch {
    // storage full or refused: the form simply starts from its defaults next time
  }
}
