// Plant setup: keys (the log's equipment picker shares them) and the page, loaded on demand.
export { setupKeys } from './api/setup-keys';
export const loadPlantPage = async () => (await import('./routes/plant-page')).PlantPage;
