import type { CondenserDesignSi } from '../../../shared/calc/evaluate';
import { NotFound } from '../../lib/errors';
import { CondenserDesign, PlantUnit } from '../plant/model';

/** The unit's condenser design data, as the calculation engine takes it. */
export async function loadCondenserDesign(unitId: number): Promise<CondenserDesignSi> {
  const unit = await PlantUnit.findByPk(unitId);
  if (!unit) throw new NotFound('That unit');
  const row = await CondenserDesign.findOne({ where: { unitId } });
  if (!row) throw new NotFound('Condenser design data for that unit');
  return {
    surfaceAreaM2: row.surfaceAreaM2,
    tubeOdMm: row.tubeOdMm,
    tubeGaugeBwg: row.tubeGaugeBwg,
    tubeMaterial: row.tubeMaterial,
    tubeCount: row.tubeCount,
    passes: row.passes,
    designCwFlowKgS: row.designCwFlowKgS,
    designCwInletK: row.designCwInletK,
    designBackpressurePa: row.designBackpressurePa,
    designDutyW: row.designDutyW,
    designCleanliness: row.designCleanliness,
    designCleanUWM2K: row.designCleanUWM2K,
    backpressureCorrection: typeof row.backpressureCorrection === 'string' ? JSON.parse(row.backpressureCorrection) : row.backpressureCorrection,
    energyPricePerMwh: row.energyPricePerMwh,
    currency: row.currency,
  };
}
