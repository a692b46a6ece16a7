// Training: keys for the live-update map and the pages, loaded on demand.
export { trainingKeys } from './api/training-keys';
export const loadTrainingPage = async () => (await import('./routes/training-page')).TrainingPage;
export const loadTraineePage = async () => (await import('./routes/trainee-page')).TraineePage;
