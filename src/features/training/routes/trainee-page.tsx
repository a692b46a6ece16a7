import { Link, useParams } from 'react-router';
import { can } from '../../../../shared/policies/permissions';
import { mayAmendTraining } from '../../../../shared/policies/training';
import { Notice } from '../../../components/ui/notice';
import { ZoneNote } from '../../../components/station-time/zone-note';
import { useMe } from '../../session';
import { useTraineeProgress } from '../api/training';
import { EntryList } from '../components/entry-list';
import { ProgressMatrix } from '../components/progress-matrix';
import { useTrainingZone } from '../lib/use-training-zone';

/** One trainee's record for trainers, shift leads and administrators; trainers sign off here. */
export function TraineePage() {
  const id = Number(useParams().id);
  const progress = useTraineeProgress(id);
  const { data: me } = useMe();
  const zone = useTrainingZone();
  if (progress.error) return <Notice kind="error">{progress.error.message}</Notice>;
  if (!progress.data) return <p>Loading…</p>;
  const p = progress.data;
  return (
    <section className="flex flex-col gap-4">
      <Link to="/training" className="text-sm underline">
        ← Training
      </Link>
      <h1 className="text-2xl font-bold">{p.trainee.name}: qualification record</h1>
      <ZoneNote zone={zone} basis={zone?.basis} what="Dates and times" />
      <p>
        {p.left} {p.left === 1 ? 'task' : 'tasks'} left. Sign-offs are final; a correction is an amendment with a reason.
      </p>
      <ProgressMatrix progress={p} mayDecide={Boolean(me && can(me.role, 'training.decide'))} />
      <section aria-label="Training entries" className="flex flex-col gap-2">
        <h2 className="text-lg font-bold">Training entries</h2>
        <EntryList entries={p.entries} mayAmend={Boolean(me && mayAmendTraining(me, { kind: 'entry', traineeId: p.trainee.id }))} />
      </section>
    </section>
  );
}
