import { z } from 'zod';
import './messages';
import { absolutePressureUnitKeys, flowUnitKeys, pressureUnitKeys, temperatureUnitKeys } from './reading-set';

/** The readings an imported column can feed, with the units each may be in. */
export const importFields = {
  pressure: { label: 'Condenser pressure / vacuum', units: pressureUnitKeys },
  barometer: { label: 'Barometer', units: absolutePressureUnitKeys },
  hotwellTemperature: { label: 'Hotwell temperature', units: temperatureUnitKeys },
  cwInletTemperature: { label: 'CW inlet temperature', units: temperatureUnitKeys },
  cwOutletTemperature: { label: 'CW outlet temperature', units: temperatureUnitKeys },
  cwFlow: { label: 'CW flow', units: flowUnitKeys },
  steamFlow: { label: 'Exhaust steam flow', units: ['t_h', 'kg_s'] },
  dissolvedOxygenPpb: { label: 'Condensate dissolved oxygen', units: ['ppb'] },
  basinTemperature: { label: 'Tower basin temperature', units: temperatureUnitKeys },
  wetBulbTemperature: { label: 'Wet bulb', units: temperatureUnitKeys },
  dryBulbTemperature: { label: 'Dry bulb', units: temperatureUnitKeys },
  relativeHumidityPercent: { label: 'Relative humidity', units: ['percent'] },
} as const satisfies Record<string, { label: string; units: readonly string[] }>;
export type ImportField = keyof typeof importFields;
export const requiredImportFields: ImportField[] = ['pressure', 'hotwellTemperature', 'cwInletTemperature', 'cwOutletTemperature'];

const column = z.object({ column: z.string().min(1).max(200), unit: z.string().min(1).max(20) });

export const importMappingSchema = z
  .object({
    source: z.string().trim().min(1, 'Name the source (e.g. the historian export)').max(80),
    timeColumn: z.string().min(1, 'Choose the time column').max(200),
    columns: z.partialRecord(z.enum(Object.keys(importFields) as [ImportField, ...ImportField[]]), column),
  })
  .superRefine((mapping, ctx) => {
    for (const field of requiredImportFields) {
      if (!mapping.columns[field]) ctx.addIssue({ code: 'custom', path: ['columns', field], message: `Map a column to ${importFields[field].label}` });
    }
    for (const [field, spec] of Object.entries(mapping.columns)) {
      const allowed = importFields[field as ImportField].units as readonly string[];
      if (spec && !allowed.includes(spec.unit)) {
        ctx.addIssue({ code: 'custom', path: ['columns', field, 'unit'], message: `${importFields[field as ImportField].label}: choose one of the units offered for it` });
      }
    }
  });
export type ImportMapping = z.infer<typeof importMappingSchema>;

export type ImportRowReport = { row: number; takenAt: string | null; status: 'valid' | 'invalid' | 'duplicate'; errors: Record<string, string> };
