import { otherFieldMessages } from '../../lib/form-errors';
import { Notice } from './notice';

/**
 * The top-of-form summary of a failed request: its plain message, then one line for each field
 * that has no place beside an input in this form (`placed` lists those that do).
 */
export function FormErrorSummary({ error, placed = [] }: { error: unknown; placed?: readonly string[] }) {
  if (!error) return null;
  const others = otherFieldMessages(error, placed);
  const message = error instanceof Error ? error.message : 'Something went wrong; nothing was saved';
  return (
    <Notice kind="error">
      {message}
      {others.length ? (
        <ul className="mt-1 list-inside list-disc">
          {others.map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
      ) : null}
    </Notice>
  );
}
