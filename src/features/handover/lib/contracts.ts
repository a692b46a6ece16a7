// The board's shared contracts, loaded as the page opens rather than with its code: a reader's first
// load carries no zod (see components/form/lazy-contract.ts).
import { lazyContract } from '../../../components/form/lazy-contract';

const handovers = () => import('../../../../shared/schemas/handovers');

export const handoverAmendmentContract = lazyContract(async () => (await handovers()).handoverAmendmentSchema);
export const attachmentReasonContract = lazyContract(async () => (await handovers()).attachmentReasonSchema);
export const answerContract = lazyContract(async () => (await handovers()).answerSchema);
export const questionContract = lazyContract(async () => (await handovers()).questionSchema);
export const newHandoverItemContract = lazyContract(async () => (await handovers()).newHandoverItemSchema);
export const editHandoverItemContract = lazyContract(async () => (await handovers()).editHandoverItemSchema);
