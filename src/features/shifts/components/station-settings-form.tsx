import { stationSettingsSchema, type StationSettings } from '../../../../shared/schemas/log';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/form-field';
import { Notice } from '../../../components/ui/notice';
import { FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { useSaveStationSettings } from '../api/station-settings';

// The change times are typed as one line ("06:00, 18:00") and the minutes as text; everything else is the shared contract as it is.
const minuteFields = ['lateEntryMinutes', 'roundIntervalMinutes', 'handoverWindowBeforeMinutes', 'handoverWindowAfterMinutes'] as const;
type FormValues = Omit<StationSettings, 'shiftChangeTimes' | (typeof minuteFields)[number]> & { shiftChangeTimes: string } & Record<(typeof minuteFields)[number], string>;

const splitTimes = (text: string) =>
  text
    .split(',')
    .map((t) => t.trim())
    .filter(Boolean);

// Empty is NaN, which the contract words as an error.
const asNumber = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));

const formSchema = throughContract(
  (v: FormValues) => ({ ...v, shiftChangeTimes: splitTimes(v.shiftChangeTimes), ...Object.fromEntries(minuteFields.map((f) => [f, asNumber(v[f])])) }),
  stationSettingsSchema,
  // A message on one of the times (shiftChangeTimes.1) belongs to the one box they are typed in.
  (path) => (path.startsWith('shiftChangeTimes') ? 'shiftChangeTimes' : undefined),
);

const toForm = (settings: StationSettings): FormValues => ({
  ...settings,
  shiftChangeTimes: settings.shiftChangeTimes.join(', '),
  ...(Object.fromEntries(minuteFields.map((f) => [f, String(settings[f])])) as Record<(typeof minuteFields)[number], string>),
});

/** Administrators: the station's clock, shift pattern, round interval and handover window, checked by the shared contract. */
export function StationSettingsForm({ stationId, settings }: { stationId: number; settings: StationSettings }) {
  const save = useSaveStationSettings(stationId);
  const form = useSchemaForm(formSchema, { defaultValues: toForm(settings), placed: ['timeZone', 'shiftChangeTimes', ...minuteFields] });
  const { errors } = form.formState;
  const onSubmit = form.submit(async (values) => form.reset(toForm(await save.mutateAsync(values))));

  return (
    <form aria-label="Station clock and shifts" noValidate onSubmit={onSubmit} className="grid gap-3 rounded-lg border border-line bg-panel p-3 text-sm sm:grid-cols-2">
      <h2 className="font-bold sm:col-span-2">Station clock and shifts</h2>
      <FormFailure form={form} className="sm:col-span-2" />
      <TextField label="Time zone (IANA)" hint="e.g. Europe/Berlin. Every time on every page is shown in this zone." error={errors.timeZone?.message} {...form.register('timeZone')} />
      <TextField
        label="Shift change times, station time"
        hint="e.g. 06:00, 18:00 for 12-hour shifts; 06:00, 14:00, 22:00 for 8-hour"
        error={form.error('shiftChangeTimes')}
        {...form.register('shiftChangeTimes')}
      />
      <TextField label="Late entry after (minutes)" inputMode="numeric" error={errors.lateEntryMinutes?.message} {...form.register('lateEntryMinutes')} />
      <TextField
        label="Round interval (minutes)"
        inputMode="numeric"
        hint="A round older than this shows as overdue on the overview. Plants differ (hourly to once a shift); 240 is only a starting point — use your procedures’ figure."
        error={errors.roundIntervalMinutes?.message}
        {...form.register('roundIntervalMinutes')}
      />
      <TextField
        label="Handover window before a change (minutes)"
        inputMode="numeric"
        hint="How early the outgoing crew may submit its handover."
        error={errors.handoverWindowBeforeMinutes?.message}
        {...form.register('handoverWindowBeforeMinutes')}
      />
      <TextField
        label="Handover window after a change (minutes)"
        inputMode="numeric"
        hint="How long after the change the incoming crew may still acknowledge and accept."
        error={errors.handoverWindowAfterMinutes?.message}
        {...form.register('handoverWindowAfterMinutes')}
      />
      {save.isSuccess && !form.formState.isDirty ? (
        <div className="sm:col-span-2">
          <Notice kind="success">Saved.</Notice>
        </div>
      ) : null}
      <div className="sm:col-span-2">
        <Button type="submit" disabled={save.isPending}>
          Save station settings
        </Button>
      </div>
    </form>
  );
}
