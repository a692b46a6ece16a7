import { useEffect } from 'react';
import { useWatch } from 'react-hook-form';
import { formatStationTime, toStationInputValue } from '../../../../shared/station-time';
import { discard, type QueuedRecord } from '../../offline';
import { useMe } from '../../session';
import { newLogEntrySchema, type StationSettings } from '../../../../shared/schemas/log';
import { Button } from '../../../components/ui/button';
import { FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { emptyStationTime, StationTimeInput, stationTimeToWire, useStationTimeFormField, type StationTimeValue } from '../../../components/station-time/station-time-input';
import { useAddEntry, useEquipment } from '../api/log';

const field = 'rounded-md border border-line bg-field px-2 py-1';

type Values = { text: string; category: string; eventAt: StationTimeValue; equipmentId: string; carryToHandover: boolean };

/** One line, keyboard only: type, Enter. Category, time and links are optional extras. */
/** `fixing`: an entry refused on arrival, put back in the bar by its author; it leaves the device once the corrected one is saved or kept. */
export function EntryBar({ unitId, settings, position, fixing = null, onFixed }: { unitId: number; settings: StationSettings; position: string; fixing?: QueuedRecord | null; onFixed?: () => void }) {
  const { data: me } = useMe();
  const add = useAddEntry(unitId);
  const equipment = useEquipment(unitId);
  const schema = throughContract(
    (v: Values, fail) => {
      // An empty entry is said so beside the box in the words of this bar, not silently ignored.
      if (!v.text.trim()) fail('text', 'Entry text is missing: write what happened');
      const eventAt = stationTimeToWire(v.eventAt, settings.timeZone, fail, 'eventAt');
      return { position, category: v.category, text: v.text.trim(), ...(eventAt ? { eventAt } : {}), equipmentId: v.equipmentId ? Number(v.equipmentId) : null, carryToHandover: v.carryToHandover };
    },
    newLogEntrySchema,
  );
  const form = useSchemaForm(schema, {
    defaultValues: { text: '', category: settings.categories[0]?.key ?? 'other', eventAt: emptyStationTime, equipmentId: '', carryToHandover: false },
  });
  const eventAt = useStationTimeFormField(form, 'eventAt');
  const equipmentId = useWatch({ control: form.control, name: 'equipmentId' });
  const textError = form.error('text');
  const tag = equipment.data?.find((e) => String(e.id) === equipmentId)?.tag;
  // The refused entry is put in the bar once, when its author picks it: not again on each redraw (the
  // form object is new on every render), which would undo the correction being typed.
  const { reset } = form;
  const { timeZone } = settings;
  const firstCategory = settings.categories[0]?.key ?? 'other';
  useEffect(() => {
    if (!fixing) return;
    const p = fixing.payload as { text?: string; category?: string; eventAt?: string; equipmentId?: number | null; carryToHandover?: boolean };
    reset({
      text: p.text ?? '',
      category: p.category ?? firstCategory,
      eventAt: { text: toStationInputValue(p.eventAt ?? fixing.enteredAt, timeZone), repeated: 'first' },
      equipmentId: p.equipmentId ? String(p.equipmentId) : '',
      carryToHandover: Boolean(p.carryToHandover),
    });
  }, [fixing, reset, timeZone, firstCategory]);
  const onSubmit = form.submit(async (entry) => {
    await add.mutateAsync({ entry, userId: me!.id });
    form.reset({ ...form.getValues(), text: '', eventAt: emptyStationTime, carryToHandover: false });
    // The refused copy goes only when its correction was logged on its own unit.
    if (fixing && fixing.unitId === unitId) {
      await discard(fixing.clientId);
      onFixed?.();
    }
  });

  return (
    <form
      aria-label="New log entry"
      className="flex flex-col gap-2 rounded-lg border-2 border-accent bg-panel p-3"
      noValidate
      onSubmit={onSubmit}
    >
      <div className="flex flex-wrap gap-2">
        <input
          aria-label="Entry text"
          aria-invalid={Boolean(textError)}
          aria-describedby={textError ? 'entry-text-error' : undefined}
          className={`${field} min-w-0 flex-1 basis-full text-lg sm:basis-0 aria-[invalid=true]:border-alarm`}
          placeholder="What happened? Enter saves."
          maxLength={4000}
          {...form.register('text')}
        />
        <Button type="submit" size="sm" className="max-sm:flex-1" disabled={add.isPending}>
          Log it
        </Button>
      </div>
      {textError ? (
        <p id="entry-text-error" role="alert" className="text-sm font-bold text-alarm">
          ⚠ {textError}
        </p>
      ) : null}
      <div className="flex flex-wrap items-start gap-2 text-sm">
        <label className="flex flex-col">
          Category
          <select className={field} {...form.register('category')}>
            {settings.categories.map((c) => (
              <option key={c.key} value={c.key}>
                {c.label}
              </option>
            ))}
          </select>
        </label>
        <StationTimeInput label="Event time (empty = now)" field={eventAt} timeZone={settings.timeZone} error={form.error('eventAt')} />
        <label className="flex flex-col">
          Equipment
          <select className={field} {...form.register('equipmentId')}>
            <option value="">—</option>
            {equipment.data?.map((e) => (
              <option key={e.id} value={e.id}>
                {e.tag} · {e.name}
              </option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-1">
          <input type="checkbox" {...form.register('carryToHandover')} /> Carry to handover
        </label>
      </div>
      <div className="flex flex-wrap gap-1 text-sm" aria-label="Templates">
        {settings.templates.map((t) => (
          <Button
            key={t.label}
            tone="chip"
            onClick={() => {
              form.setValue('text', t.text.replace('{equipment}', tag ?? '…'), { shouldDirty: true });
              form.setValue('category', t.category, { shouldDirty: true });
            }}
          >
            {t.label}
          </Button>
        ))}
      </div>
      <FormFailure form={form} />
      {add.data?.saved?.late ? <p className="text-sm font-bold text-watch">▲ Saved as a late entry (made well after the event).</p> : null}
      {add.data?.kept ? (
        <p role="status" className="text-sm font-bold">
          <span aria-hidden="true">⏳ </span>No connection to the server: the entry is kept on this device, waiting to send (entered{' '}
          {formatStationTime(add.data.kept.enteredAt, settings.timeZone, 'datetime-seconds')}).
        </p>
      ) : null}
      {fixing ? <p className="text-sm">The refused entry is in the bar: correct it and log it; the refused copy is then removed from this device.</p> : null}
    </form>
  );
}
