import { useId, useState } from 'react';
import { parseStationTime, repeatedTimeNote, zoneLabel } from '../../../shared/station-time';

export type StationTimeField = {
  text: string;
  repeated: 'first' | 'second';
  setText: (text: string) => void;
  setRepeated: (which: 'first' | 'second') => void;
  reset: () => void;
};

/** What a station-time input holds: the wall-clock text and, in the hour the clocks go back, which of the two. */
export function useStationTimeField(initial = ''): StationTimeField {
  const [text, setTextState] = useState(initial);
  const [repeated, setRepeated] = useState<'first' | 'second'>('first');
  return {
    text,
    repeated,
    setText: (next) => {
      setTextState(next);
      setRepeated('first');
    },
    setRepeated,
    reset: () => {
      setTextState('');
      setRepeated('first');
    },
  };
}

export type StationTimeRead = { ok: true; at: Date | null } | { ok: false; message: string };

/** The instant typed (null when left empty), or the message to show beside the input. */
export function readStationTime(field: Pick<StationTimeField, 'text' | 'repeated'>, timeZone: string): StationTimeRead {
  if (!field.text.trim()) return { ok: true, at: null };
  const parsed = parseStationTime(field.text, timeZone, { repeated: field.repeated });
  return parsed.ok ? { ok: true, at: parsed.at } : parsed;
}

const inputClass = 'reading rounded-md border border-line bg-field px-2 py-1 font-normal aria-[invalid=true]:border-alarm';

/**
 * A date-and-time input read on the station's clock, whatever the device's zone, with the zone beside it.
 * A time the clocks skip shows its error at once; a repeated one says which was taken and offers the other.
 */
export function StationTimeInput({ label, field, timeZone, error, className = '' }: { label: string; field: StationTimeField; timeZone: string; error?: string | undefined; className?: string }) {
  const id = useId();
  const parsed = field.text.trim() ? parseStationTime(field.text, timeZone, { repeated: field.repeated }) : null;
  const problem = parsed && !parsed.ok ? parsed.message : error;
  const note = parsed?.ok ? repeatedTimeNote(parsed, timeZone) : null;
  const other = field.repeated === 'first' ? 'second' : 'first';
  return (
    <div className={`flex flex-col gap-0.5 ${className}`}>
      <label htmlFor={id} className="flex flex-col">
        {label}
      </label>
      <input
        id={id}
        type="datetime-local"
        className={inputClass}
        value={field.text}
        onChange={(e) => field.setText(e.target.value)}
        aria-invalid={Boolean(problem)}
        aria-describedby={`${id}-zone${problem ? ` ${id}-error` : ''}`}
      />
      <span id={`${id}-zone`} className="text-xs font-normal text-muted" data-testid="station-time-zone">
        Station time — {zoneLabel(timeZone, parsed?.ok ? parsed.at : new Date())}
      </span>
      {note ? (
        <span className="text-xs font-normal">
          ▲ {note}{' '}
          <button type="button" className="underline" onClick={() => field.setRepeated(other)}>
            Use the {other} one
          </button>
        </span>
      ) : null}
      {problem ? (
        <span id={`${id}-error`} role="alert" className="text-sm font-bold text-alarm">
          ⚠ {problem}
        </span>
      ) : null}
    </div>
  );
}
