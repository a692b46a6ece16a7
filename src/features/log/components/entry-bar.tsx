import { useState } from 'react';
import type { StationSettings } from '../../../../shared/schemas/log';
import { ApiError } from '../../../lib/api-client';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { StationTimeInput, readStationTime, useStationTimeField } from '../../../components/station-time/station-time-input';
import { useAddEntry, useEquipment } from '../api/log';

const field = 'rounded-md border border-line bg-field px-2 py-1';

/** One line, keyboard only: type, Enter. Category, time and links are optional extras. */
export function EntryBar({ unitId, settings, position }: { unitId: number; settings: StationSettings; position: string }) {
  const add = useAddEntry(unitId);
  const equipment = useEquipment(unitId);
  const [text, setText] = useState('');
  const [category, setCategory] = useState(settings.categories[0]?.key ?? 'other');
  const eventAt = useStationTimeField();
  const [equipmentId, setEquipmentId] = useState('');
  const [carry, setCarry] = useState(false);
  // An empty entry is said so beside the box, not silently ignored.
  const [missing, setMissing] = useState(false);
  const fields = add.error instanceof ApiError ? add.error.fields : {};
  const textError = missing ? 'Entry text is missing: write what happened' : fields.text;
  const tag = equipment.data?.find((e) => String(e.id) === equipmentId)?.tag;

  const submit = () => {
    const typed = readStationTime(eventAt, settings.timeZone);
    setMissing(!text.trim());
    if (!text.trim() || !typed.ok) return;
    add.mutate(
      {
        position,
        category,
        text: text.trim(),
        ...(typed.at ? { eventAt: typed.at.toISOString() } : {}),
        equipmentId: equipmentId ? Number(equipmentId) : null,
        carryToHandover: carry,
      },
      {
        onSuccess: () => {
          setText('');
          eventAt.reset();
          setCarry(false);
        },
      },
    );
  };

  return (
    <form
      aria-label="New log entry"
      className="flex flex-col gap-2 rounded-lg border-2 border-accent bg-panel p-3"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <div className="flex flex-wrap gap-2">
        <input
          aria-label="Entry text"
          aria-invalid={Boolean(textError)}
          aria-describedby={textError ? 'entry-text-error' : undefined}
          className={`${field} min-w-0 flex-1 text-lg aria-[invalid=true]:border-alarm`}
          placeholder="What happened? Enter saves."
          value={text}
          onChange={(e) => {
            setText(e.target.value);
            if (e.target.value.trim()) setMissing(false);
          }}
          maxLength={4000}
        />
        <button type="submit" className="rounded-md bg-accent px-4 py-1 font-bold text-on-accent" disabled={add.isPending}>
          Log it
        </button>
      </div>
      {textError ? (
        <p id="entry-text-error" role="alert" className="text-sm font-bold text-alarm">
          ⚠ {textError}
        </p>
      ) : null}
      <div className="flex flex-wrap items-start gap-2 text-sm">
        <label className="flex flex-col">
          Category
          <select className={field} value={category} onChange={(e) => setCategory(e.target.value)}>
            {settings.categories.map((c) => (
              <option key={c.key} value={c.key}>
                {c.label}
              </option>
            ))}
          </select>
        </label>
        <StationTimeInput label="Event time (empty = now)" field={eventAt} timeZone={settings.timeZone} error={fields.eventAt} />
        <label className="flex flex-col">
          Equipment
          <select className={field} value={equipmentId} onChange={(e) => setEquipmentId(e.target.value)}>
            <option value="">—</option>
            {equipment.data?.map((e) => (
              <option key={e.id} value={e.id}>
                {e.tag} · {e.name}
              </option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-1">
          <input type="checkbox" checked={carry} onChange={(e) => setCarry(e.target.checked)} /> Carry to handover
        </label>
      </div>
      <div className="flex flex-wrap gap-1 text-sm" aria-label="Templates">
        {settings.templates.map((t) => (
          <button
            key={t.label}
            type="button"
            className="rounded-full border border-line px-2 py-0.5"
            onClick={() => {
              setText(t.text.replace('{equipment}', tag ?? '…'));
              setCategory(t.category);
            }}
          >
            {t.label}
          </button>
        ))}
      </div>
      <FormErrorSummary error={add.error} placed={['text', 'eventAt']} />
      {add.data?.late ? <p className="text-sm font-bold text-watch">▲ Saved as a late entry (made well after the event).</p> : null}
    </form>
  );
}
