import { CalcInputError } from '../../shared/calc/input-error';
import { readingSetToSi } from '../../shared/calc/reading-set-si';
import { ValidationError } from './errors';

/** Raw readings → SI, with a conversion problem reported as a 400 on the field it came from. */
export function convertReadingSet(input: Parameters<typeof readingSetToSi>[0]) {
  try {
    return readingSetToSi(input);
  } catch (error) {
    if (error instanceof CalcInputError) throw new ValidationError({ [error.field]: error.sentence });
    throw error;
  }
}
