import { useForm, type FieldError } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { stationSettingsSchema, type StationSettings } from '../../../../shared/schemas/log';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/form-field';
import { Notice } from '../../../components/ui/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { useSaveStationSettings } from '../api/station-settings';

// The change times are typed as one line ("06:00, 18:00"); everything else is the shared contract as it is.
type FormValues = Omit<StationSettings, 'shiftChangeTimes'> & { shiftChangeTimes: string };

const splitTimes = (text: string) =>
  text
    .split(',')
    .map((t) => t.trim())
    .filter(Boolean);

const formSchema = z.preprocess((values: FormValues) => ({ ...values, shiftChangeTimes: splitTimes(values.shiftChangeTimes) }), stationSettingsSchema);

/** The first message under a field, whether it is on the field itself or on one of its items. */
function messageOf(error: unknown): string | undefined {
  if (!error || typeof error !== 'object') return undefined;
  if (typeof (error as FieldError).message === 'string') return (error as FieldError).message;
  for (const nested of Object.values(error)) {
    const message = messageOf(nested);
    if (message) return message;
  }
  return undefined;
}

const toForm = (settings: StationSettings): FormValues => ({ ...settings, shiftChangeTimes: settings.shiftChangeTimes.join(', ') });

// Called with the default (a number) as well as with what is typed; empty is NaN, which the schema words as an error.
const asNumber = { setValueAs: (v: unknown) => (typeof v === 'number' ? v : String(v ?? '').trim() === '' ? Number.NaN : Number(v)) };

/** Administrators: the station's clock, shift pattern, round interval and handover window, checked by the shared contract. */
export function StationSettingsForm({ stationId, settings }: { stationId: number; settings: StationSettings }) {
  const save = useSaveStationSettings(stationId);
  const form = useForm<FormValues, unknown, StationSettings>({
    resolver: zodResolver(formSchema),
    defaultValues: toForm(settings),
  });
  const { errors } = form.formState;
  const onSubmit = form.handleSubmit((values) =>
    save.mutate(values, {
      onSuccess: (saved) => form.reset(toForm(saved)),
      onError: (error) => form.setError('root', { message: applyServerErrors(error, form.setError) }),
    }),
  );

  return (
    <form aria-label="Station clock and shifts" noValidate onSubmit={onSubmit} className="grid gap-3 rounded-lg border border-line bg-panel p-3 text-sm sm:grid-cols-2">
      <h2 className="font-bold sm:col-span-2">Station clock and shifts</h2>
      {errors.root?.message ? (
        <div className="sm:col-span-2">
          <Notice kind="error">{errors.root.message}</Notice>
        </div>
      ) : null}
      <TextField label="Time zone (IANA)" hint="e.g. Europe/Berlin. Every time on every page is shown in this zone." error={errors.timeZone?.message} {...form.register('timeZone')} />
      <TextField
        label="Shift change times, station time"
        hint="e.g. 06:00, 18:00 for 12-hour shifts; 06:00, 14:00, 22:00 for 8-hour"
        error={messageOf(errors.shiftChangeTimes)}
        {...form.register('shiftChangeTimes')}
      />
      <TextField label="Late entry after (minutes)" inputMode="numeric" error={errors.lateEntryMinutes?.message} {...form.register('lateEntryMinutes', asNumber)} />
      <TextField
        label="Round interval (minutes)"
        inputMode="numeric"
        hint="A round older than this shows as overdue on the overview. Plants differ (hourly to once a shift); 240 is only a starting point — use your procedures’ figure."
        error={errors.roundIntervalMinutes?.message}
        {...form.register('roundIntervalMinutes', asNumber)}
      />
      <TextField
        label="Handover window before a change (minutes)"
        inputMode="numeric"
        hint="How early the outgoing crew may submit its handover."
        error={errors.handoverWindowBeforeMinutes?.message}
        {...form.register('handoverWindowBeforeMinutes', asNumber)}
      />
      <TextField
        label="Handover window after a change (minutes)"
        inputMode="numeric"
        hint="How long after the change the incoming crew may still acknowledge and accept."
        error={errors.handoverWindowAfterMinutes?.message}
        {...form.register('handoverWindowAfterMinutes', asNumber)}
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
