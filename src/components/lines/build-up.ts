/**
 * A build-up as a form holds it: layers with thicknesses as typed (display units), the finish, whether
 * it is the site's default, sized or taken as built. Converts to and from the API's SI build-up.
 */
import { formatInputNumber, fromDisplay, parseNumber, toDisplay, type UnitSystem } from '../../calc/units';
import type { BuildUp } from '../../api/types';

export type BuildUpMode = 'siteDefault' | 'own';

export interface BuildUpDraft {
  mode: BuildUpMode;
  /** Existing insulation: taken as built and only checked (every layer needs its thickness). */
  fixed: boolean;
  layers: { materialId: string; thickness: string }[];
  finishId: string;
}

export const MAX_LAYERS = 6;

/** A converted number without the float noise of the conversion (0.0381, not 0.038099999999999995). */
export const clean = (x: number) => Number(x.toPrecision(12));

/** Field names of build-up errors, as the form shows them. */
export const buildUpField = {
  layers: 'buildUp.layers',
  finish: 'buildUp.finishId',
  material: (i: number) => `buildUp.layers[${i}].materialId`,
  thickness: (i: number) => `buildUp.layers[${i}].thicknessM`,
};

/** The draft of a stored build-up (null: the site's default for the item's service). */
export function buildUpToDraft(b: BuildUp | null | undefined, system: UnitSystem, fallback?: BuildUp): BuildUpDraft {
  const src = b ?? fallback ?? { layers: [{ materialId: '' }], finishId: '' };
  return {
    mode: b ? 'own' : 'siteDefault',
    fixed: !!src.fixed,
    layers: src.layers.map((l) => ({
      materialId: l.materialId,
      thickness: l.thicknessM === undefined ? '' : formatInputNumber(toDisplay('thickness', system, l.thicknessM)),
    })),
    finishId: src.finishId,
  };
}

/**
 * The SI build-up of a draft, or the errors that stop it (keyed as {@link buildUpField}). The outermost
 * layer of a build-up to size needs no thickness; a fixed build-up needs every one. `initial` is the
 * build-up the draft started from: a thickness left as it was shown keeps its exact stored value.
 */
export function draftToBuildUp(
  d: BuildUpDraft,
  system: UnitSystem,
  initial?: BuildUp | null,
): { buildUp: BuildUp | null; errors: Record<string, string> } {
  const errors: Record<string, string> = {};
  if (d.mode === 'siteDefault') return { buildUp: null, errors };
  if (!d.fixed && d.layers.length === 0) errors[buildUpField.layers] = 'Add a layer: the outermost layer is the one sized';
  const shownBefore = initial ? buildUpToDraft(initial, system) : null;
  const layers = d.layers.map((l, i) => {
    if (!l.materialId) errors[buildUpField.material(i)] = `Layer ${i + 1}: choose a material`;
    const sized = !d.fixed && i === d.layers.length - 1;
    if (sized) return { materialId: l.materialId };
    const text = l.thickness.trim();
    if (text === '') {
      errors[buildUpField.thickness(i)] = `Layer ${i + 1}: give its thickness${d.fixed ? '' : ' (only the outermost layer is sized)'}`;
      return { materialId: l.materialId };
    }
    const n = parseNumber(text);
    if (n === null) {
      errors[buildUpField.thickness(i)] = `Layer ${i + 1}: thickness must be a number`;
      return { materialId: l.materialId };
    }
    const same = shownBefore?.layers[i]?.thickness === l.thickness && initial?.layers[i]?.thicknessM !== undefined;
    return { materialId: l.materialId, thicknessM: same ? (initial!.layers[i].thicknessM as number) : clean(fromDisplay('thickness', system, n)) };
  });
  if (!d.finishId) errors[buildUpField.finish] = 'Choose an outer finish';
  const buildUp: BuildUp = { layers, finishId: d.finishId, ...(d.fixed ? { fixed: true } : {}) };
  return { buildUp: Object.keys(errors).length > 0 ? null : buildUp, errors };
}
