// The one way a form is built: react-hook-form checked by a shared zod contract (zodResolver), the
// server's field messages put back beside the same inputs, and the rest listed by their labels.
// zod and the resolver are loaded on demand (see lazy-contract.ts): a page may pass its contract as
// a lazy one and draw before they arrive; the first check waits for them.
import { useEffect, useId, useRef, useState, type BaseSyntheticEvent } from 'react';
import { useForm, type FieldErrors, type FieldValues, type Resolver, type UseFormProps, type UseFormReturn } from 'react-hook-form';
import type { z } from 'zod';
import { lazyContract, loadContract, type Contract, type LazyContract } from './lazy-contract';
import { applyServerErrors, isPlaced, labelled, otherFieldMessages, type FieldPlacement } from '../../lib/form-errors';
import { Notice } from '../ui/notice';

/** Reports a value the form cannot turn into the contract's shape (a box that is not a number, a time the clocks skip). */
export type Fail = (field: string, message: string) => void;

/**
 * The shared schema as a form sees it, where the form holds values in another shape than the wire (numbers typed in
 * the person's unit, station-time inputs, one box for a list): `toWire` converts, the shared schema checks exactly as
 * the server does, and each of its issues comes back on the form field that holds it (`fieldFor`, else its path).
 * Server validation is untouched: this only asks the same contract earlier.
 */
export function throughContract<TForm, TSchema extends z.ZodType>(
  toWire: (values: TForm, fail: Fail) => unknown,
  contract: Contract<TSchema>,
  fieldFor: (path: string) => string | undefined = () => undefined,
): LazyContract<z.ZodType<z.output<TSchema>, TForm>> {
  return lazyContract(async () => {
    // zod by its named exports from a module of its own, so the bundler keeps only what is used.
    const [{ checkedThrough }, schema] = await Promise.all([import('./checked-through'), loadContract(contract)]);
    return checkedThrough(toWire, schema, fieldFor);
  });
}

const CHECKS_UNAVAILABLE = 'checks-unavailable';
const checksUnavailable = 'The form’s checks could not be loaded, so nothing was saved: check the connection and save again.';

/** react-hook-form's resolver for a contract: zodResolver, once it and the contract are loaded. */
function contractResolver<S extends z.ZodType>(contract: Contract<S>): Resolver<FieldValues, unknown, unknown> {
  return async (values, context, options) => {
    let loaded: [typeof import('@hookform/resolvers/zod'), S];
    try {
      loaded = await Promise.all([import('@hookform/resolvers/zod'), loadContract(contract)]);
    } catch {
      // The checks' code did not arrive (the connection dropped first): refuse, and say so (see useSchemaForm's submit).
      return { values: {}, errors: { root: { type: CHECKS_UNAVAILABLE, message: checksUnavailable } } };
    }
    const [{ zodResolver }, schema] = loaded;
    return (zodResolver(schema as never) as unknown as Resolver<FieldValues, unknown, unknown>)(values, context, options);
  };
}

type Options<TIn extends FieldValues, TOut> = Omit<UseFormProps<TIn, unknown, TOut>, 'resolver'> & Partial<FieldPlacement>;

export type SchemaForm<TIn extends FieldValues, TOut> = UseFormReturn<TIn, unknown, TOut> & {
  placement: FieldPlacement;
  /** The last failed request, until the next submit. */
  failure: unknown;
  /** Shows a failed request: field messages beside their inputs, the rest in the form's summary. */
  fail: (error: unknown) => void;
  /** The submit handler: the contract first, then `send`; a failure of `send` is shown on the form. `refused`: the contract said no. */
  submit: (send: (values: TOut) => Promise<unknown> | unknown, refused?: (errors: FieldErrors<TIn>) => void) => (event?: BaseSyntheticEvent) => Promise<void>;
  /** The message to show beside a field, if any. */
  error: (field: string) => string | undefined;
  /** What a field's input carries so a screen reader hears its message: `aria-invalid`, and `aria-describedby` naming the message. */
  describe: (field: string) => { 'aria-invalid': boolean; 'aria-describedby': string | undefined };
  /** A field's message with the id its input points at (`<FieldMessage {...form.messageFor('text')} />`). */
  messageFor: (field: string) => { message: string | undefined; id: string };
};

/** react-hook-form with the shared contract as its resolver; see `throughContract` for forms whose values differ from the wire. */
export function useSchemaForm<TSchema extends z.ZodType<unknown, FieldValues>>(
  contract: Contract<TSchema>,
  { placed, fieldFor, ...options }: Options<z.input<TSchema>, z.output<TSchema>>,
): SchemaForm<z.input<TSchema>, z.output<TSchema>> {
  type TIn = z.input<TSchema>;
  type TOut = z.output<TSchema>;
  const form = useForm<TIn, unknown, TOut>({ ...options, resolver: contractResolver(contract) as never });
  // Fetched as the form appears, so a submit seldom waits for it. (A page may build its contract on each
  // render; fetching the first is enough: they share the code they load.)
  const firstContract = useRef(contract);
  useEffect(() => {
    void loadContract(firstContract.current).catch(() => undefined);
    void import('@hookform/resolvers/zod').catch(() => undefined);
  }, []);
  const formId = useId();
  const messageId = (field: string) => `${formId}-${field.replace(/[^\w-]/g, '-')}-message`;
  const [failure, setFailure] = useState<unknown>(null);
  const placement: FieldPlacement = { placed: placed ?? Object.keys(options.defaultValues ?? {}), fieldFor };
  const fail = (error: unknown) => {
    setFailure(error);
    applyServerErrors(error, form.setError, placement);
  };
  return {
    ...form,
    placement,
    failure,
    fail,
    submit: (send, refused) =>
      form.handleSubmit(
        async (values) => {
          setFailure(null);
          try {
            await send(values);
          } catch (error) {
            fail(error);
          }
        },
        (errors) => {
          const root = (errors as { root?: { type?: string } }).root;
          setFailure(root?.type === CHECKS_UNAVAILABLE ? new Error(checksUnavailable) : null);
          refused?.(errors);
        },
      ),
    error: (field) => messageAt(form.formState.errors, field),
    describe: (field) => {
      const message = messageAt(form.formState.errors, field);
      return { 'aria-invalid': Boolean(message), 'aria-describedby': message ? messageId(field) : undefined };
    },
    messageFor: (field) => ({ message: messageAt(form.formState.errors, field), id: messageId(field) }),
  };
}

/** The first message at or under a field (a list's item, a nested box). */
export function messageAt(errors: unknown, field: string): string | undefined {
  const node = field.split('.').reduce<unknown>((at, key) => (at && typeof at === 'object' ? (at as Record<string, unknown>)[key] : undefined), errors);
  return firstMessage(node);
}

function firstMessage(node: unknown): string | undefined {
  if (!node || typeof node !== 'object') return undefined;
  const own = (node as { message?: unknown }).message;
  if (typeof own === 'string' && own) return own;
  for (const [key, child] of Object.entries(node)) {
    if (key === 'ref') continue;
    const message = firstMessage(child);
    if (message) return message;
  }
  return undefined;
}

/** Every client-side message on a field that has no input in this form, named by its label. */
function unplacedMessages(errors: FieldErrors, placed: readonly string[], prefix = ''): string[] {
  const lines: string[] = [];
  for (const [key, node] of Object.entries(errors)) {
    if (key === 'root' || key === 'ref' || !node || typeof node !== 'object') continue;
    const path = prefix ? `${prefix}.${key}` : key;
    if (isPlaced(path, placed)) continue;
    const own = (node as { message?: unknown }).message;
    if (typeof own === 'string' && own) lines.push(labelled(path, own));
    else lines.push(...unplacedMessages(node as FieldErrors, placed, path));
  }
  return lines;
}

/** Every client-side message on a field this form shows an input for. */
function placedMessages(errors: FieldErrors, placed: readonly string[], prefix = ''): string[] {
  const lines: string[] = [];
  for (const [key, node] of Object.entries(errors)) {
    if (key === 'root' || key === 'ref' || !node || typeof node !== 'object') continue;
    const path = prefix ? `${prefix}.${key}` : key;
    const own = (node as { message?: unknown }).message;
    if (typeof own === 'string' && own) {
      if (isPlaced(path, placed)) lines.push(own);
    } else lines.push(...placedMessages(node as FieldErrors, placed, path));
  }
  return lines;
}

const messageOf = (error: unknown) =>
  error && typeof error === 'object' && 'fields' in error && typeof (error as { fields: Record<string, string> }).fields._ === 'string'
    ? (error as { fields: Record<string, string> }).fields._!
    : error instanceof Error
      ? error.message
      : 'Something went wrong; nothing was saved';

/**
 * The top of a form: the failed request's message, then one line for each field that has no input here
 * (the server's and the contract's alike); nothing when all is well.
 */
export function FormFailure<TIn extends FieldValues, TOut>({ form, className, summary = true }: { form: SchemaForm<TIn, TOut>; className?: string; summary?: boolean }) {
  const others = [
    ...(form.failure ? otherFieldMessages(form.failure, form.placement.placed, form.placement.fieldFor) : []),
    ...unplacedMessages(form.formState.errors as FieldErrors, form.placement.placed),
  ].filter((line, i, all) => all.indexOf(line) === i);
  // A submit refused for fields shown beside their inputs: one alert says so, so a screen reader hears
  // it at once (each message is linked to its input). Off where the page words its own (`summary={false}`).
  const placedAfterSubmit = summary && form.formState.isSubmitted && !form.formState.isSubmitSuccessful && placedMessages(form.formState.errors as FieldErrors, form.placement.placed).length > 0;
  if (!form.failure && !others.length && !placedAfterSubmit) return null;
  const notice = (
    <Notice kind="error">
      {form.failure ? messageOf(form.failure) : others.length ? 'Nothing was saved:' : 'Nothing was saved: check the fields marked ⚠.'}
      {others.length ? (
        <ul className="mt-1 list-inside list-disc">
          {others.map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
      ) : null}
    </Notice>
  );
  return className ? <div className={className}>{notice}</div> : notice;
}

/**
 * A field's message as the inline forms show it, beside the input, which names it (`form.describe`):
 * read with the field, not shouted on its own; the form's summary (FormFailure) is the alert.
 */
export function FieldMessage({ message, id, className = 'text-alarm' }: { message: string | undefined; id?: string; className?: string }) {
  if (!message) return null;
  return (
    <span id={id} className={className}>
      ⚠ {message}
    </span>
  );
}
