import { can } from '../../../../shared/policies/permissions';
import { formatStationTime } from '../../../../shared/station-time';
import { UnitPicker, useSelectedUnit } from '../../../components/readings/unit-picker';
import { Notice } from '../../../components/ui/notice';
import { ZoneNote } from '../../../components/station-time/zone-note';
import { equipmentSchema } from '../../../../shared/schemas/plant';
import { Button } from '../../../components/ui/button';
import { FormFailure, useSchemaForm } from '../../../components/form/schema-form';
import { useMe } from '../../session';
import { useChangeSetup, useUnitSetup, useVersionsSavedHere, type UnitSetup } from '../api/setup';
import { DesignForm } from '../components/design-form';
import { LimitsForm } from '../components/limits-form';
import { PlausibleRangesForm } from '../components/plausible-ranges-form';
import { useWatchUnit } from '../../../app/use-live-updates';

function History({ title, rows, timeZone }: { title: string; rows: UnitSetup['designHistory']; timeZone: string }) {
  return (
    <div className="rounded-lg border border-line bg-panel p-3 text-sm">
      <h3 className="font-bold">{title}</h3>
      <ul>
        {rows.map((r, i) => (
          <li key={r.id} className="border-t border-line py-1">
            <span className="reading">{formatStationTime(r.effectiveFrom, timeZone)}</span> · {r.by} · {r.note}
            {i === 0 ? <strong> (in force)</strong> : null}
          </li>
        ))}
      </ul>
    </div>
  );
}

function Equipment({ setup, editable }: { setup: UnitSetup; editable: boolean }) {
  const change = useChangeSetup(setup.unit.id);
  const form = useSchemaForm(equipmentSchema, { defaultValues: { kind: 'cw_pump', tag: '', name: '' }, placed: [] });
  const input = 'rounded-md border border-line bg-field px-2 py-1';
  return (
    <div className="rounded-lg border border-line bg-panel p-3 text-sm">
      <h2 className="font-bold">Equipment</h2>
      <ul>
        {setup.equipment.map((e) => (
          <li key={e.id} className="border-t border-line py-1">
            <span className="reading font-semibold">{e.tag}</span> — {e.name} <span className="text-muted">({e.kind.replace('_', ' ')})</span>
          </li>
        ))}
      </ul>
      {editable ? (
        <form
          aria-label="Add equipment"
          noValidate
          className="mt-2 flex flex-wrap items-end gap-2"
          onSubmit={form.submit(async (equipment) => {
            await change.mutateAsync({ kind: 'equipment', equipment });
            form.reset({ ...form.getValues(), tag: '', name: '' });
          })}
        >
          <select aria-label="Kind" className={input} {...form.register('kind')}>
            <option value="cw_pump">CW pump</option>
            <option value="condenser">Condenser</option>
            <option value="cooling_tower">Cooling tower</option>
            <option value="air_removal">Air removal</option>
            <option value="other">Other</option>
          </select>
          <input aria-label="Tag" placeholder="Tag" className={input} {...form.register('tag')} />
          <input aria-label="Name" placeholder="Name" className={input} {...form.register('name')} />
          <Button type="submit" size="sm">
            Add
          </Button>
          {/* The three boxes sit on one line: their messages follow it, each named by its label. */}
          <FormFailure form={form} className="w-full" />
        </form>
      ) : null}
    </div>
  );
}

export function PlantPage() {
  const { data: me } = useMe();
  const { unitId, unit } = useSelectedUnit();
  useWatchUnit(unitId);
  const setup = useUnitSetup(unitId);
  const { versions: savedHere, onVersionSaved } = useVersionsSavedHere();
  const editable = Boolean(me && can(me.role, 'plant.manage'));
  return (
    <section className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-4">
        <div>
          <h1 className="text-2xl font-bold">Plant setup</h1>
          <p className="text-muted">Design data, limits and plausible ranges are versioned: each reading is judged by the versions in force when it was taken.</p>
          <ZoneNote zone={unit} />
        </div>
        <UnitPicker />
      </div>
      {setup.error ? <Notice kind="error">{setup.error.message}</Notice> : null}
      {setup.data && unit ? (
        <div className="grid gap-4 lg:grid-cols-2" key={`${setup.data.unit.id}-${setup.data.design.versionId}-${setup.data.limits.versionId}-${setup.data.plausible.versionId}`}>
          <div className="flex flex-col gap-4">
            <DesignForm unitId={setup.data.unit.id} design={setup.data.design.data} editable={editable} saved={savedHere.design === setup.data.design.versionId} onVersionSaved={onVersionSaved} />
            <History title="Design data versions" rows={setup.data.designHistory} timeZone={unit.timeZone} />
            <Equipment setup={setup.data} editable={editable} />
          </div>
          <div className="flex flex-col gap-4">
            <LimitsForm unitId={setup.data.unit.id} limits={setup.data.limits.data} editable={editable} saved={savedHere.limits === setup.data.limits.versionId} onVersionSaved={onVersionSaved} />
            <History title="Limit versions" rows={setup.data.limitHistory} timeZone={unit.timeZone} />
            <PlausibleRangesForm
              unitId={setup.data.unit.id}
              ranges={setup.data.plausible.data}
              own={setup.data.plausible.versionId !== null}
              editable={editable}
              saved={savedHere.plausible === setup.data.plausible.versionId}
              onVersionSaved={onVersionSaved}
            />
            {setup.data.plausibleHistory.length ? <History title="Plausible range versions" rows={setup.data.plausibleHistory} timeZone={unit.timeZone} /> : null}
          </div>
        </div>
      ) : null}
    </section>
  );
}
