import { Button } from '../../../components/ui/button';

type Props = { editable: boolean; note: string; onNote: (note: string) => void; error?: string; pending: boolean; saveLabel: string; readOnlyText: string };

/** The foot of a versioned settings form: why it changed, and save — or why this person cannot. */
export function SaveVersion({ editable, note, onNote, error, pending, saveLabel, readOnlyText }: Props) {
  if (!editable) return <p className="text-sm text-muted">{readOnlyText}</p>;
  return (
    <>
      <label className="flex flex-col text-sm">
        What changed and why
        <input className="rounded-md border border-line bg-field px-2 py-1" value={note} onChange={(e) => onNote(e.target.value)} />
        {error ? <span role="alert" className="text-alarm">⚠ {error}</span> : null}
      </label>
      <Button type="submit" disabled={pending}>
        {saveLabel}
      </Button>
    </>
  );
}
