// The standing-orders feature as other features see it: import from here, never from its files.
export { StandingOrder } from './model';
export { ordersInForceDuring, pendingFor, presentOrder } from './service';
