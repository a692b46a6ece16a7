import { qualificationSystemLabels, qualificationSystems } from '../../../../shared/schemas/training';

/** Tasks grouped by plant system, in the catalogue's system order (unknown systems last). */
export function groupBySystem<T>(items: readonly T[], systemOf: (item: T) => string): { system: string; label: string; items: T[] }[] {
  const order = (system: string) => {
    const at = (qualificationSystems as readonly string[]).indexOf(system);
    return at < 0 ? qualificationSystems.length : at;
  };
  const groups = new Map<string, T[]>();
  for (const item of items) (groups.get(systemOf(item)) ?? groups.set(systemOf(item), []).get(systemOf(item))!).push(item);
  return [...groups.entries()]
    .sort(([a], [b]) => order(a) - order(b) || a.localeCompare(b))
    .map(([system, grouped]) => ({ system, label: qualificationSystemLabels[system as keyof typeof qualificationSystemLabels] ?? system, items: grouped }));
}
