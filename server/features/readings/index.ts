// The readings feature as other features see it: import from here, never from its files.
export { ReadingAmendment, ReadingCountersign, ReadingSet, ReadingValue } from './model';
export { checkTakenAt, findRound, getReading, latestEvaluationBetween, roundIdsBetween, storeImportBatch } from './service';
