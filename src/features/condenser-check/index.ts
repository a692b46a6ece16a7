// The condenser check scratch pad: its page, loaded on demand.
export const loadCondenserCheckPage = async () => (await import('./routes/condenser-check-page')).CondenserCheckPage;
