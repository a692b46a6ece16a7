import { useState } from 'react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { StationSettings } from '../../../../shared/schemas/log';
import { useSelectedUnit } from '../../../components/readings/unit-picker';
import { Notice } from '../../../components/ui/notice';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { ApiError, api } from '../../../lib/api-client';
import { useCrews } from '../../../components/plant/crews';
import { StationTimeInput, readStationTime, useStationTimeField } from '../../../components/station-time/station-time-input';
import { useStationSettings } from '../api/station-settings';
import { StationSettingsForm } from '../components/station-settings-form';
import { logKeys } from '../../log/api/log';

const field = 'rounded-md border border-line bg-field px-2 py-1';

/** Administrators: the station's clock and shift pattern, crew rotation and one-off swaps. */
export function ShiftsPage() {
  const { unit, unitId } = useSelectedUnit();
  const stationId = unit?.stationId ?? null;
  const queryClient = useQueryClient();
  const crews = useCrews();
  const stationSettings = useStationSettings(stationId);
  const shifts = useQuery({
    queryKey: logKeys.shifts(unitId ?? 0),
    queryFn: () => api.get<{ settings: StationSettings; shifts: { start: string; label: string }[] }>(`/api/units/${unitId}/log/shifts`),
    enabled: unitId !== null,
  });
  const [anchor, setAnchor] = useState('');
  const [order, setOrder] = useState<number[]>([]);
  const [swap, setSwap] = useState({ crewId: '', reason: '' });
  const swapStart = useStationTimeField();
  const refresh = () => void queryClient.invalidateQueries();
  const saveRotation = useMutation({ mutationFn: (body: { anchorShiftStart: string; crewIds: number[] }) => api.put(`/api/stations/${stationId}/crew-rotation`, body), onSuccess: refresh });
  const addSwap = useMutation({ mutationFn: (body: { shiftStart: string; crewId: number; reason: string }) => api.post(`/api/stations/${stationId}/crew-swaps`, body), onSuccess: refresh });
  const settings = shifts.data?.settings;
  if (!settings) return <p className="text-muted">Loading…</p>;

  return (
    <section className="flex max-w-3xl flex-col gap-4">
      <h1 className="text-2xl font-bold">Shifts and crews</h1>
      {stationId !== null && stationSettings.data ? <StationSettingsForm key={stationId} stationId={stationId} settings={stationSettings.data} /> : null}
      {stationSettings.error ? <Notice kind="error">{stationSettings.error.message}</Notice> : null}

      <form
        aria-label="Crew rotation"
        className="flex flex-col gap-2 rounded-lg border border-line bg-panel p-3 text-sm"
        onSubmit={(e) => {
          e.preventDefault();
          saveRotation.mutate({ anchorShiftStart: anchor, crewIds: order });
        }}
      >
        <h2 className="font-bold">Crew rotation</h2>
        <p>Crews take the shifts in the order ticked, one shift each, starting with the chosen shift.</p>
        <label className="flex flex-col">
          First shift of the rotation (station time, {settings.timeZone})
          <select className={field} value={anchor} onChange={(e) => setAnchor(e.target.value)}>
            <option value="">Choose…</option>
            {shifts.data?.shifts.map((s) => (
              <option key={s.start} value={s.start}>
                {s.label}
              </option>
            ))}
          </select>
        </label>
        <div className="flex flex-wrap gap-2">
          {crews.data?.map((c) => (
            <button key={c.id} type="button" className={`rounded-md border px-2 py-1 ${order.includes(c.id) ? 'border-accent font-bold' : 'border-line'}`} onClick={() => setOrder(order.includes(c.id) ? order.filter((x) => x !== c.id) : [...order, c.id])}>
              Crew {c.name}
              {order.includes(c.id) ? ` (#${order.indexOf(c.id) + 1})` : ''}
            </button>
          ))}
        </div>
        <FormErrorSummary error={saveRotation.error} />
        {saveRotation.isSuccess ? <Notice kind="success">Rotation saved.</Notice> : null}
        <button type="submit" className="self-start rounded-md bg-accent px-3 py-1 font-bold text-on-accent">
          Save rotation
        </button>
      </form>

      <form
        aria-label="One-off swap"
        className="flex flex-col gap-2 rounded-lg border border-line bg-panel p-3 text-sm"
        onSubmit={(e) => {
          e.preventDefault();
          // Read on the station's saved clock; an unsaved zone typed above does not apply yet.
          const start = readStationTime(swapStart, settings.timeZone);
          if (!start.ok) return;
          addSwap.mutate({ shiftStart: start.at ? start.at.toISOString() : '', crewId: Number(swap.crewId), reason: swap.reason });
        }}
      >
        <h2 className="font-bold">One-off swap</h2>
        <StationTimeInput label="Shift starting" field={swapStart} timeZone={settings.timeZone} error={addSwap.error instanceof ApiError ? addSwap.error.fields.shiftStart : undefined} />
        <label className="flex flex-col">
          Crew working it instead
          <select className={field} value={swap.crewId} onChange={(e) => setSwap({ ...swap, crewId: e.target.value })}>
            <option value="">Choose…</option>
            {crews.data?.map((c) => (
              <option key={c.id} value={c.id}>
                Crew {c.name}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col">
          Reason
          <input className={field} value={swap.reason} onChange={(e) => setSwap({ ...swap, reason: e.target.value })} />
        </label>
        <FormErrorSummary error={addSwap.error} placed={['shiftStart']} />
        {addSwap.isSuccess ? <Notice kind="success">Swap recorded.</Notice> : null}
        <button type="submit" className="self-start rounded-md bg-accent px-3 py-1 font-bold text-on-accent">
          Record swap
        </button>
      </form>
    </section>
  );
}
