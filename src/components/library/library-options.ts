import type { LibraryPayload } from '../../api/types';
import type { UnitSystem } from '../../calc/units';
import { listTemperature } from '../lines/row-format';
import type { SelectOption } from '../ui/select-field';

/** Materials as a build-up offers them: built-in and the team's own side by side, each with its range. */
export function materialOptions(lib: LibraryPayload | undefined, system: UnitSystem): SelectOption[] {
  if (!lib) return [];
  const range = (min: number, max: number) => `${listTemperature(min, system)} to ${listTemperature(max, system)}`;
  return [
    ...lib.materials.map((m) => ({ value: m.id, label: m.name, detail: `${m.specification}; ${range(m.minServiceTemperatureC, m.maxServiceTemperatureC)}` })),
    ...lib.teamMaterials.map((m) => ({ value: m.materialId, label: `${m.name} (team)`, detail: `${m.source}; ${range(m.minServiceTemperatureC, m.maxServiceTemperatureC)}` })),
  ];
}

export function finishOptions(lib: LibraryPayload | undefined): SelectOption[] {
  if (!lib) return [];
  const eps = (e: number) => `ε ${e.toFixed(2)}`;
  return [
    ...lib.finishes.map((f) => ({ value: f.id, label: f.name, detail: eps(f.emissivity) })),
    ...lib.teamFinishes.map((f) => ({ value: f.finishId, label: `${f.name} (team)`, detail: eps(f.emissivity) })),
  ];
}

/** The name of a material or finish id of either library (the id itself when it is not there). */
export function libraryName(lib: LibraryPayload | undefined, id: string): string {
  if (!lib) return id;
  return (
    lib.materials.find((m) => m.id === id)?.name ??
    lib.teamMaterials.find((m) => m.materialId === id)?.name ??
    lib.finishes.find((f) => f.id === id)?.name ??
    lib.teamFinishes.find((f) => f.finishId === id)?.name ??
    id
  );
}
