/**
 * Words for the parts of an item that reports and comparisons print: its size, purposes, build-up and
 * governing layers.
 */
import type { BuildUp, ItemSizing, Purpose } from '../../shared/calc/sizing/types';
import type { SnapshotItem } from '../revisions/snapshot';
import { PURPOSE_NAMES, PURPOSE_SHORT, type DisplayUnits } from './display';

/** Names of the materials and finishes a list uses (by id). */
export type LibraryNames = { material: (id: string) => string; finish: (id: string) => string };

export function libraryNames(library: { materials: { id: string; name: string }[]; finishes: { id: string; name: string }[] }): LibraryNames {
  const m = new Map(library.materials.map((x) => [x.id, x.name]));
  const f = new Map(library.finishes.map((x) => [x.id, x.name]));
  return { material: (id) => m.get(id) ?? id, finish: (id) => f.get(id) ?? id };
}

/** NPS 4, DN 100, OD 60.3 mm; vessels Ø 2400 mm × 6.0 m. */
export function sizeLabel(it: SnapshotItem, du: DisplayUnits): string {
  if (it.kind === 'vessel') return `Ø ${du.diameter(it.outerDiameterM)} × ${du.length(it.lengthM)}`;
  if (it.sizeKind === 'nps' && it.nps) return `NPS ${it.nps}`;
  if (it.sizeKind === 'dn' && it.dn) return `DN ${it.dn}`;
  return `OD ${du.diameter(it.outerDiameterM)}`;
}

export const purposesShort = (ps: readonly Purpose[]) => ps.map((p) => PURPOSE_SHORT[p]).join(' ');
export const purposesLong = (ps: readonly Purpose[]) => ps.map((p) => PURPOSE_NAMES[p]).join(', ');

/** Consecutive layers of one material, as a contractor reads them: [material, thicknesses]. */
export function layerGroups(layers: readonly { materialId: string; thicknessM: number }[]): { materialId: string; thicknessesM: number[] }[] {
  const out: { materialId: string; thicknessesM: number[] }[] = [];
  for (const l of layers) {
    const last = out[out.length - 1];
    if (last && last.materialId === l.materialId) last.thicknessesM.push(l.thicknessM);
    else out.push({ materialId: l.materialId, thicknessesM: [l.thicknessM] });
  }
  return out;
}

/**
 * The governing build-up in words: "Mineral-fibre … 60 + 50 mm" (`name` may give the short codes of a
 * report's legend instead of full names).
 */
export function layersText(result: Pick<ItemSizing, 'layers'> | null, du: DisplayUnits, name: (id: string) => string): string {
  if (!result) return '';
  if (result.layers.length === 0) return 'bare';
  return layerGroups(result.layers)
    .map((g) => `${name(g.materialId)} ${g.thicknessesM.map((t) => du.thicknessValue(t)).join(' + ')} ${du.system === 'SI' ? 'mm' : 'in'}`)
    .join('; ');
}

/** A build-up as entered on the item: the site's default, or its layers (the outermost sized). */
export function buildUpText(b: BuildUp | null, du: DisplayUnits, names: LibraryNames): string {
  if (!b) return "site's default";
  const layers = b.layers.map((l, i) => {
    const sized = !b.fixed && i === b.layers.length - 1;
    return `${names.material(l.materialId)} ${sized ? '(sized)' : l.thicknessM !== undefined ? du.thickness(l.thicknessM) : '?'}`;
  });
  return `${b.fixed ? 'fixed: ' : ''}${layers.length ? layers.join(' + ') : 'bare'}; finish ${names.finish(b.finishId)}`;
}
