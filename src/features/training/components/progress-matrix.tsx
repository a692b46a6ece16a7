import { formatStationTime } from '../../../../shared/station-time';
import { useTrainingZone } from '../lib/use-training-zone';
import { decisionSchema, qualificationSystemLabels, type TaskStatus, taskStatusLabels } from '../../../../shared/schemas/training';
import { Button } from '../../../components/ui/button';
import { FieldMessage, FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { useDecide, type Progress, type ProgressRow } from '../api/training';
import { groupBySystem } from '../lib/group-by-system';

// Status carried by a symbol and a word as well as colour.
const statusLook: Record<TaskStatus, { icon: string; className: string }> = {
  not_started: { icon: '○', className: 'text-muted' },
  in_progress: { icon: '◐', className: 'text-ink' },
  ready_for_sign_off: { icon: '◉', className: 'text-accent' },
  returned: { icon: '↺', className: 'text-watch' },
  signed_off: { icon: '✔', className: 'text-normal' },
};

export function TaskStatusLabel({ status }: { status: TaskStatus }) {
  return (
    <span className={`font-bold whitespace-nowrap ${statusLook[status].className}`}>
      <span aria-hidden="true">{statusLook[status].icon}</span> {taskStatusLabels[status]}
    </span>
  );
}

function DecisionForm({ traineeId, row }: { traineeId: number; row: ProgressRow }) {
  const decide = useDecide();
  // Which of the two buttons was pressed is a value of the form: the decision is part of what the contract checks.
  const schema = throughContract((v: { comments: string; decision: string }) => ({ traineeId, taskKey: row.task.taskKey, ...v }), decisionSchema);
  const form = useSchemaForm(schema, { defaultValues: { comments: '', decision: '' } });
  const send = (chosen: 'signed_off' | 'returned') => {
    form.setValue('decision', chosen);
    void form.submit(async (input) => {
      await decide.mutateAsync(input);
      form.reset();
    })();
  };
  return (
    <form className="flex flex-col gap-1" aria-label={`Decide on ${row.task.taskKey}`} noValidate onSubmit={(e) => e.preventDefault()}>
      <label className="flex flex-col text-xs font-bold">
        Trainer’s comments
        <textarea className="rounded-md border border-line bg-field p-1 font-normal" rows={2} {...form.register('comments')} {...form.describe('comments')} />
      </label>
      <FieldMessage {...form.messageFor('comments')} className="text-xs font-bold text-alarm" />
      <FormFailure form={form} />
      <div className="flex gap-1">
        <Button size="xs" className="text-xs" disabled={decide.isPending || row.status !== 'ready_for_sign_off'} onClick={() => send('signed_off')}>
          Sign off
        </Button>
        <Button tone="plain" size="xs" className="text-xs" disabled={decide.isPending} onClick={() => send('returned')}>
          Return with comments
        </Button>
      </div>
    </form>
  );
}

/** Tasks down the side, where the trainee stands across. Trainers get sign-off controls per row. */
export function ProgressMatrix({ progress, mayDecide }: { progress: Progress; mayDecide: boolean }) {
  const zone = useTrainingZone();
  return (
    <div className="overflow-x-auto rounded-lg border border-line bg-panel">
      <table className="w-full text-left text-sm" aria-label={`Qualification tasks for ${progress.trainee.name}`}>
        <thead>
          <tr className="border-b border-line">
            <th className="p-2">Task</th>
            <th className="p-2">System</th>
            <th className="p-2">Status</th>
            <th className="p-2 text-right">Observed</th>
            <th className="p-2 text-right">Supervised</th>
            <th className="p-2 text-right">Alone</th>
            <th className="p-2 text-right">Counted / needed</th>
            <th className="p-2">Dates</th>
            <th className="p-2">Last decision</th>
            {mayDecide ? <th className="p-2">Trainer</th> : null}
          </tr>
        </thead>
        {groupBySystem(progress.rows, (row) => row.task.system).map((group) => (
          <tbody key={group.system}>
            <tr>
              <th colSpan={mayDecide ? 10 : 9} scope="rowgroup" className="bg-field p-2 text-left">
                {group.label}
              </th>
            </tr>
            {group.items.map((row) => (
            <tr key={row.task.taskKey} className="border-t border-line align-top" data-testid={`task-row-${row.task.taskKey}`}>
              <td className="p-2">
                <strong>{row.task.taskKey}</strong> {row.task.title}
                <span className="block text-xs text-muted">
                  v{row.task.version}
                  {row.task.procedureRef ? ` · ${row.task.procedureRef}` : ''}
                  {row.task.retired ? ' · retired' : ''}
                </span>
              </td>
              <td className="p-2">{qualificationSystemLabels[row.task.system as keyof typeof qualificationSystemLabels] ?? row.task.system}</td>
              <td className="p-2">
                <TaskStatusLabel status={row.status} />
                {row.signedVersion !== null ? <span className="block text-xs">signed against v{row.signedVersion}</span> : null}
                {row.newerVersionSinceSignOff ? <span className="block text-xs font-bold text-watch">▲ task changed since (v{row.task.version})</span> : null}
                {row.counts.awaitingCountersign ? <span className="block text-xs">{row.counts.awaitingCountersign} awaiting countersign</span> : null}
              </td>
              <td className="p-2 text-right">{row.counts.observed}</td>
              <td className="p-2 text-right">{row.counts.supervised}</td>
              <td className="p-2 text-right">{row.counts.alone}</td>
              <td className="p-2 text-right">
                {row.performances} / {row.task.requiredPerformances}
              </td>
              <td className="p-2 text-xs">{row.firstPracticeOn ? `${row.firstPracticeOn} – ${row.lastPracticeOn}` : '—'}</td>
              <td className="p-2 text-xs">
                {row.lastDecision ? (
                  <>
                    {row.lastDecision.decision === 'signed_off' ? 'Signed off' : 'Returned'} by {row.lastDecision.trainer}, {zone ? formatStationTime(row.lastDecision.decidedAt, zone.timeZone, 'date') : '…'}
                    <span className="block italic">“{row.lastDecision.comments}”</span>
                    {row.lastDecision.amendments.map((a) => (
                      <span key={a.id} className="block">
                        Amended by {a.by}: <em>{a.reason}</em> — {a.text}
                      </span>
                    ))}
                  </>
                ) : (
                  '—'
                )}
              </td>
              {mayDecide ? <td className="p-2">{row.status === 'signed_off' || row.task.retired ? null : <DecisionForm traineeId={progress.trainee.id} row={row} />}</td> : null}
            </tr>
            ))}
          </tbody>
        ))}
      </table>
    </div>
  );
}
