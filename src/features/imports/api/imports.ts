import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ImportMapping, ImportRowReport } from '../../../../shared/schemas/imports';
import { ApiError, api } from '../../../lib/api-client';
import { invalidateForChange } from '../../../app/live-keys';

import { importKeys } from './import-keys';
export { importKeys };

export type Inspection = { headers: string[]; sample: Record<string, string>[]; rowCount: number };
/** `timeZone`: the station zone in which times without an offset were read. */
export type Preview = { timeZone: string; counts: { rows: number; valid: number; invalid: number; duplicate: number }; rows: ImportRowReport[] };
/** `imported`: rows stored now; `alreadyThere`: rows an earlier import had stored (skipped); stored `batches` of up to `batchRows`. */
export type ImportResult = {
  timeZone: string;
  imported: number;
  alreadyThere: number;
  batches: number;
  batchRows: number;
  /** Rows stored marked "outside plausible range". */
  outsidePlausible: number;
  flagsRaised: number;
  counts: Preview['counts'];
  problems: ImportRowReport[];
};

/** The server stopped part-way: the batches it stored stay (its message says how many rows). */
export const importIsIncomplete = (error: Error | null) => error instanceof ApiError && error.code === 'IMPORT_INCOMPLETE';

const form = (file: File, mapping?: ImportMapping) => {
  const data = new FormData();
  data.append('file', file);
  if (mapping) data.append('mapping', JSON.stringify(mapping));
  return data;
};

export const useRememberedMappings = (unitId: number | null) =>
  useQuery({
    queryKey: importKeys.mappings(unitId ?? 0),
    queryFn: async () => (await api.get<{ mappings: { source: string; mapping: ImportMapping }[] }>(`/api/units/${unitId}/import-mappings`)).mappings,
    enabled: unitId !== null,
  });

export const useInspect = (unitId: number | null) =>
  useMutation({ mutationFn: (file: File) => api.upload<Inspection>(`/api/units/${unitId}/imports/inspect`, form(file)) });

export const usePreview = (unitId: number | null) =>
  useMutation({ mutationFn: (a: { file: File; mapping: ImportMapping }) => api.upload<Preview>(`/api/units/${unitId}/imports/preview`, form(a.file, a.mapping)) });

export function useCommitImport(unitId: number | null) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (a: { file: File; mapping: ImportMapping }) => api.upload<ImportResult>(`/api/units/${unitId}/imports`, form(a.file, a.mapping)),
    // Whole batches may be stored even when the import stopped part-way.
    onSettled: (_data, error) => {
      if (error && !importIsIncomplete(error)) return;
      if (unitId) invalidateForChange(queryClient, { entity: 'import', id: unitId, unitId });
      void queryClient.invalidateQueries({ queryKey: importKeys.mappings(unitId ?? 0) });
    },
  });
}
