import { useId } from 'react';
import { useWatch, type FieldValues, type Path, type PathValue, type UseFormReturn } from 'react-hook-form';
import { parseStationTime, repeatedTimeNote, zoneLabel } from '../../../shared/station-time';
import type { Fail } from '../form/schema-form';
import { Button } from '../ui/button';

export type StationTimeField = {
  text: string;
  repeated: 'first' | 'second';
  setText: (text: string) => void;
  setRepeated: (which: 'first' | 'second') => void;
  reset: () => void;
};

/** What a station-time input holds in a form: the wall-clock text and, in the hour the clocks go back, which of the two. */
export type StationTimeValue = { text: string; repeated: 'first' | 'second' };
export const emptyStationTime: StationTimeValue = { text: '', repeated: 'first' };

/** A station-time input kept in a schema form under `name` (a `StationTimeValue`). */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- any form whose field `name` holds a StationTimeValue
export function useStationTimeFormField<T extends FieldValues>(form: UseFormReturn<T, any, any>, name: Path<T>): StationTimeField {
  const value = (useWatch({ control: form.control, name }) as StationTimeValue | undefined) ?? emptyStationTime;
  const set = (next: StationTimeValue) =>
    form.setValue(name, next as PathValue<T, Path<T>>, { shouldDirty: true, shouldValidate: form.formState.isSubmitted });
  return {
    text: value.text,
    repeated: value.repeated,
    setText: (text) => set({ text, repeated: 'first' }),
    setRepeated: (repeated) => set({ ...value, repeated }),
    reset: () => set(emptyStationTime),
  };
}

/** For a form's conversion to the contract: the instant as ISO text, undefined when left empty, a message on `field` when it is not a time on the station's clock. */
export function stationTimeToWire(value: StationTimeValue, timeZone: string, fail: Fail, field: string): string | undefined {
  const read = readStationTime(value, timeZone);
  if (!read.ok) {
    fail(field, read.message);
    return undefined;
  }
  return read.at?.toISOString();
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
          <Button tone="link" onClick={() => field.setRepeated(other)}>
            Use the {other} one
          </Button>
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
