import { useState } from 'react';
import type { z } from 'zod';
import { newTaskSchema, qualificationSystemLabels, qualificationSystems, taskChangeSchema } from '../../../../shared/schemas/training';
import { Button } from '../../../components/ui/button';
import { FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { SelectField, TextField } from '../../../components/ui/form-field';
import { Notice } from '../../../components/ui/notice';
import { ApiError } from '../../../lib/api-client';
import { useRetireTask, useSaveTask, useTasks, useTaskVersions, type TaskView } from '../api/training';
import { formatStationTime } from '../../../../shared/station-time';
import { useTrainingZone } from '../lib/use-training-zone';
import { groupBySystem } from '../lib/group-by-system';

type Values = { taskKey: string; position: string; system: string; title: string; standard: string; procedureRef: string; requiredPerformances: string; changeNote: string };
const blank: Values = { taskKey: '', position: 'field_operator', system: 'circulating_water', title: '', standard: '', procedureRef: '', requiredPerformances: '3', changeNote: '' };

// The number of performances is typed; a new task names its key, a change says why.
const taskFields = (v: Values) => ({ position: v.position, system: v.system, title: v.title, standard: v.standard, procedureRef: v.procedureRef || null, requiredPerformances: Number(v.requiredPerformances) });
const newTaskForm = throughContract((v: Values) => ({ ...taskFields(v), taskKey: v.taskKey }), newTaskSchema);
const changeTaskForm = throughContract((v: Values) => ({ ...taskFields(v), changeNote: v.changeNote }), taskChangeSchema);
type TaskContract = z.ZodType<z.output<typeof newTaskSchema> | z.output<typeof taskChangeSchema>, Values>;

function TaskForm({ editing, onDone }: { editing: TaskView | null; onDone: () => void }) {
  const save = useSaveTask();
  const form = useSchemaForm<TaskContract>(editing ? changeTaskForm : newTaskForm, {
    defaultValues: editing ? { ...blank, ...editing, procedureRef: editing.procedureRef ?? '', requiredPerformances: String(editing.requiredPerformances), changeNote: '' } : blank,
  });
  const errors = form.formState.errors;
  const submit = form.submit(async (task) => {
    const { taskKey, ...body } = 'taskKey' in task ? task : { ...task, taskKey: editing?.taskKey ?? '' };
    await save.mutateAsync({ mode: editing ? 'change' : 'create', taskKey, body });
    onDone();
  });
  return (
    <form onSubmit={submit} noValidate aria-label={editing ? `Change ${editing.taskKey}` : 'New task'} className="grid gap-3 rounded-lg border border-accent bg-panel p-3 sm:grid-cols-2">
      <h3 className="font-bold sm:col-span-2">{editing ? `Change ${editing.taskKey} (becomes version ${editing.version + 1})` : 'New qualification task'}</h3>
      <FormFailure form={form} className="sm:col-span-2" />
      {editing ? null : <TextField label="Key" hint="e.g. CW-07" error={errors.taskKey?.message} {...form.register('taskKey')} />}
      <TextField label="Position" hint="e.g. field_operator, control_room_operator" list="qualification-positions" error={errors.position?.message} {...form.register('position')} />
      <datalist id="qualification-positions">
        <option value="field_operator" />
        <option value="control_room_operator" />
      </datalist>
      <SelectField label="System" error={errors.system?.message} {...form.register('system')}>
        {qualificationSystems.map((s) => (
          <option key={s} value={s}>
            {qualificationSystemLabels[s]}
          </option>
        ))}
      </SelectField>
      <TextField label="Title" error={errors.title?.message} {...form.register('title')} />
      <div className="sm:col-span-2">
        <TextField label="Standard to meet" error={errors.standard?.message} {...form.register('standard')} />
      </div>
      <TextField label="Procedure reference" error={errors.procedureRef?.message} {...form.register('procedureRef')} />
      <TextField label="Supervised performances before sign-off" type="number" min={1} error={errors.requiredPerformances?.message} {...form.register('requiredPerformances')} />
      {editing ? (
        <div className="sm:col-span-2">
          <TextField label="What changed and why" error={errors.changeNote?.message} {...form.register('changeNote')} />
        </div>
      ) : null}
      <div className="flex gap-2 sm:col-span-2">
        <Button type="submit" disabled={form.formState.isSubmitting}>
          Save
        </Button>
        <Button tone="plain" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

function Versions({ taskKey }: { taskKey: string }) {
  const versions = useTaskVersions(taskKey);
  const zone = useTrainingZone();
  return (
    <ul className="mt-1 text-xs">
      {versions.data?.map((v) => (
        <li key={v.id}>
          v{v.version} · {zone ? formatStationTime(v.createdAt, zone.timeZone, 'date') : '…'} · {v.changeNote ?? ''} · {v.requiredPerformances} performances{v.retired ? ' · retired' : ''}
        </li>
      ))}
    </ul>
  );
}

/** The qualification catalogue: everyone reads it; trainers and administrators change it (each change a new version). */
export function CataloguePanel({ mayEdit }: { mayEdit: boolean }) {
  const tasks = useTasks();
  const retire = useRetireTask();
  const [editing, setEditing] = useState<TaskView | 'new' | null>(null);
  const [history, setHistory] = useState<string | null>(null);
  return (
    <section aria-label="Qualification catalogue" className="flex flex-col gap-2">
      <div className="flex items-center gap-3">
        <h2 className="text-lg font-bold">Qualification catalogue</h2>
        {mayEdit && editing === null ? (
          <Button tone="plain" size="sm" onClick={() => setEditing('new')}>
            New task
          </Button>
        ) : null}
      </div>
      {editing ? <TaskForm editing={editing === 'new' ? null : editing} onDone={() => setEditing(null)} /> : null}
      {retire.error ? <Notice kind="error">{retire.error instanceof ApiError ? retire.error.message : 'Not retired'}</Notice> : null}
      <div className="overflow-x-auto rounded-lg border border-line bg-panel">
        <table className="w-full text-left text-sm">
          <thead>
            <tr>
              <th className="p-2">Key</th>
              <th className="p-2">Task and standard</th>
              <th className="p-2">System · position</th>
              <th className="p-2">Procedure</th>
              <th className="p-2 text-right">Needed</th>
              <th className="p-2">Version</th>
            </tr>
          </thead>
          {groupBySystem(tasks.data ?? [], (t) => t.system).map((group) => (
            <tbody key={group.system}>
              <tr>
                <th colSpan={6} scope="rowgroup" className="bg-field p-2 text-left">
                  {group.label}
                </th>
              </tr>
              {group.items.map((t) => (
              <tr key={t.taskKey} className="border-t border-line align-top">
                <td className="p-2 font-bold">{t.taskKey}</td>
                <td className="p-2">
                  {t.title}
                  <span className="block text-xs text-muted">{t.standard}</span>
                </td>
                <td className="p-2">
                  {qualificationSystemLabels[t.system as keyof typeof qualificationSystemLabels] ?? t.system} · {t.position.replace(/_/g, ' ')}
                </td>
                <td className="p-2">{t.procedureRef ?? '—'}</td>
                <td className="p-2 text-right">{t.requiredPerformances}</td>
                <td className="p-2">
                  <Button tone="link" onClick={() => setHistory(history === t.taskKey ? null : t.taskKey)}>
                    v{t.version}
                  </Button>
                  {history === t.taskKey ? <Versions taskKey={t.taskKey} /> : null}
                  {mayEdit ? (
                    <span className="mt-1 flex gap-2 text-xs">
                      <Button tone="link" onClick={() => setEditing(t)}>
                        Change
                      </Button>
                      <Button
                        tone="link"
                        className="text-alarm"
                        onClick={() => {
                          const note = window.prompt(`Why is ${t.taskKey} retired?`);
                          if (note) retire.mutate({ taskKey: t.taskKey, changeNote: note });
                        }}
                      >
                        Retire
                      </Button>
                    </span>
                  ) : null}
                </td>
              </tr>
              ))}
            </tbody>
          ))}
        </table>
      </div>
    </section>
  );
}
