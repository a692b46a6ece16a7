// A shared zod contract fetched when a page opens rather than with its code. zod is ~30 kB of
// gzip'd JavaScript: the pages a crew opens most (rounds, the handover board) draw without it and
// check with it as soon as it arrives — the same contract, the same messages, moments later.
import type { z } from 'zod';
import { once, useLoaded } from '../../lib/load-on-demand';

export type LazyContract<S extends z.ZodType> = { readonly load: () => Promise<S> };
export type Contract<S extends z.ZodType> = S | LazyContract<S>;

export const lazyContract = <S extends z.ZodType>(load: () => Promise<S>): LazyContract<S> => ({ load: once(load) });

const isLazy = <S extends z.ZodType>(contract: Contract<S>): contract is LazyContract<S> =>
  typeof (contract as { load?: unknown }).load === 'function' && !('_zod' in contract);

export const loadContract = <S extends z.ZodType>(contract: Contract<S>): Promise<S> => (isLazy(contract) ? contract.load() : Promise.resolve(contract));

/** The contract once loaded (fetched at mount), null until then. */
export const useLoadedContract = <S extends z.ZodType>(contract: LazyContract<S>): S | null => useLoaded(contract.load);
