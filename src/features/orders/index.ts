// Standing orders: keys, the prompt the shell shows at sign-in, and the page, loaded on demand.
export { orderKeys } from './api/order-keys';
export { PendingOrdersPrompt } from './components/pending-orders-prompt-loader';
export const loadOrdersPage = async () => (await import('./routes/orders-page')).OrdersPage;
