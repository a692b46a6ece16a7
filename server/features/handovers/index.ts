// The handovers feature as other features see it: import from here, never from its files.
export { handoverItemExists, handoversAroundShift, itemWithHandover, lockedHandoverStatus } from './lookups';
export { Handover, HandoverAck, HandoverAmendment, HandoverItem, HandoverQuery } from './model';
export { type HandoverService } from './service';
export { viewHandover } from './view';
