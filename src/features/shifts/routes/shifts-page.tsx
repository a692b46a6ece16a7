import { useWatch } from 'react-hook-form';
import { crewRotationSchema, crewSwapSchema } from '../../../../shared/schemas/handovers';
import { useSelectedUnit } from '../../../components/readings/unit-picker';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useCrews } from '../../../components/plant/crews';
import { FieldMessage, FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { emptyStationTime, StationTimeInput, stationTimeToWire, useStationTimeFormField, type StationTimeValue } from '../../../components/station-time/station-time-input';
import { useShifts } from '../../log';
import { useStationSettings } from '../api/station-settings';
import { useAddSwap, useSaveRotation } from '../api/crew-rotation';
import { StationSettingsForm } from '../components/station-settings-form';

const field = 'rounded-md border border-line bg-field px-2 py-1';

function RotationForm({ stationId, timeZone, shifts }: { stationId: number | null; timeZone: string; shifts: { start: string; label: string }[] }) {
  const crews = useCrews();
  const save = useSaveRotation(stationId);
  const form = useSchemaForm(crewRotationSchema, { defaultValues: { anchorShiftStart: '', crewIds: [] } });
  const order = useWatch({ control: form.control, name: 'crewIds' });
  const toggle = (id: number) => form.setValue('crewIds', order.includes(id) ? order.filter((x) => x !== id) : [...order, id], { shouldDirty: true });
  return (
    <form aria-label="Crew rotation" noValidate className="flex flex-col gap-2 rounded-lg border border-line bg-panel p-3 text-sm" onSubmit={form.submit((values) => save.mutateAsync(values))}>
      <h2 className="font-bold">Crew rotation</h2>
      <p>Crews take the shifts in the order ticked, one shift each, starting with the chosen shift.</p>
      <label className="flex flex-col">
        First shift of the rotation (station time, {timeZone})
        <select className={field} {...form.register('anchorShiftStart')} {...form.describe('anchorShiftStart')}>
          <option value="">Choose…</option>
          {shifts.map((s) => (
            <option key={s.start} value={s.start}>
              {s.label}
            </option>
          ))}
        </select>
        <FieldMessage {...form.messageFor('anchorShiftStart')} />
      </label>
      <div role="group" aria-label="Crew order" aria-describedby={form.describe('crewIds')['aria-describedby']} className="flex flex-wrap gap-2">
        {crews.data?.map((c) => (
          <Button key={c.id} tone="toggle" pressed={order.includes(c.id)} onClick={() => toggle(c.id)}>
            Crew {c.name}
            {order.includes(c.id) ? ` (#${order.indexOf(c.id) + 1})` : ''}
          </Button>
        ))}
      </div>
      <FieldMessage {...form.messageFor('crewIds')} />
      <FormFailure form={form} />
      {save.isSuccess ? <Notice kind="success">Rotation saved.</Notice> : null}
      <Button type="submit" size="sm" className="self-start">
        Save rotation
      </Button>
    </form>
  );
}

type SwapValues = { shiftStart: StationTimeValue; crewId: string; reason: string };

function SwapForm({ stationId, timeZone }: { stationId: number | null; timeZone: string }) {
  const crews = useCrews();
  const add = useAddSwap(stationId);
  // Read on the station's saved clock; an unsaved zone typed above does not apply yet.
  const schema = throughContract(
    (v: SwapValues, fail) => ({ shiftStart: stationTimeToWire(v.shiftStart, timeZone, fail, 'shiftStart') ?? '', crewId: Number(v.crewId), reason: v.reason }),
    crewSwapSchema,
  );
  const form = useSchemaForm(schema, { defaultValues: { shiftStart: emptyStationTime, crewId: '', reason: '' } });
  const shiftStart = useStationTimeFormField(form, 'shiftStart');
  return (
    <form aria-label="One-off swap" noValidate className="flex flex-col gap-2 rounded-lg border border-line bg-panel p-3 text-sm" onSubmit={form.submit((values) => add.mutateAsync(values))}>
      <h2 className="font-bold">One-off swap</h2>
      <StationTimeInput label="Shift starting" field={shiftStart} timeZone={timeZone} error={form.error('shiftStart')} />
      <label className="flex flex-col">
        Crew working it instead
        <select className={field} {...form.register('crewId')} {...form.describe('crewId')}>
          <option value="">Choose…</option>
          {crews.data?.map((c) => (
            <option key={c.id} value={c.id}>
              Crew {c.name}
            </option>
          ))}
        </select>
        <FieldMessage {...form.messageFor('crewId')} />
      </label>
      <label className="flex flex-col">
        Reason
        <input className={field} {...form.register('reason')} {...form.describe('reason')} />
        <FieldMessage {...form.messageFor('reason')} />
      </label>
      <FormFailure form={form} />
      {add.isSuccess ? <Notice kind="success">Swap recorded.</Notice> : null}
      <Button type="submit" size="sm" className="self-start">
        Record swap
      </Button>
    </form>
  );
}

/** Administrators: the station's clock and shift pattern, crew rotation and one-off swaps. */
export function ShiftsPage() {
  const { unit, unitId } = useSelectedUnit();
  const stationId = unit?.stationId ?? null;
  const stationSettings = useStationSettings(stationId);
  const shifts = useShifts(unitId);
  const settings = shifts.data?.settings;
  if (!settings) return <p className="text-muted">Loading…</p>;

  return (
    <section className="flex max-w-3xl flex-col gap-4">
      <h1 className="text-2xl font-bold">Shifts and crews</h1>
      {stationId !== null && stationSettings.data ? <StationSettingsForm key={stationId} stationId={stationId} settings={stationSettings.data} /> : null}
      {stationSettings.error ? <Notice kind="error">{stationSettings.error.message}</Notice> : null}
      <RotationForm stationId={stationId} timeZone={settings.timeZone} shifts={shifts.data?.shifts ?? []} />
      <SwapForm stationId={stationId} timeZone={settings.timeZone} />
    </section>
  );
}
