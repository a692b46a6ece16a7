// The calculation engine behind the live checks (the same one the server uses), in a chunk of its
// own: the round form draws and takes typing before it arrives (see use-live-evaluation.ts).
export { evaluateReadingSet } from '../../../shared/calc/evaluate';
export { readingSetToSi } from '../../../shared/calc/reading-set-si';
export { describeImplausible } from '../../../shared/plausibility-display';
