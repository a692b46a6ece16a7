import { useState } from 'react';
import { can, type Action } from '../../../../shared/policies/permissions';
import type { Role } from '../../../../shared/roles';
import { Notice } from '../../../components/ui/notice';
import { ZoneNote } from '../../../components/station-time/zone-note';
import { useMe } from '../../session';
import { MyReviewComments } from '../../logbook';
import { useMyProgress } from '../api/training';
import { CataloguePanel } from '../components/catalogue-panel';
import { CountersignQueue } from '../components/countersign-queue';
import { CrewQualifications } from '../components/crew-qualifications';
import { EntryList } from '../components/entry-list';
import { ProgressMatrix } from '../components/progress-matrix';
import { RecordPracticeForm } from '../components/record-practice-form';
import { ReviewQueue } from '../components/review-queue';
import { useTrainingZone } from '../lib/use-training-zone';
import { Button } from '../../../components/ui/button';

type Tab = 'mine' | 'countersign' | 'queue' | 'crews' | 'catalogue';
const tabLabels: Record<Tab, string> = { mine: 'My qualification record', countersign: 'Countersign', queue: 'Trainer’s queue', crews: 'Crew qualifications', catalogue: 'Catalogue' };

/** Each tab is there for whoever holds its permission; the catalogue is for everyone. */
const tabPermission: Record<Tab, Action | null> = {
  mine: 'training.practice',
  countersign: 'training.countersign',
  queue: 'training.review-queue',
  crews: 'training.crews',
  catalogue: null,
};
const tabsFor = (role: Role): Tab[] => (Object.keys(tabPermission) as Tab[]).filter((tab) => tabPermission[tab] === null || can(role, tabPermission[tab]));

function MyRecord() {
  const progress = useMyProgress(true);
  if (progress.error) return <Notice kind="error">{progress.error.message}</Notice>;
  if (!progress.data) return <p>Loading your record…</p>;
  return (
    <div className="flex flex-col gap-4">
      <p>
        <strong>{progress.data.left}</strong> {progress.data.left === 1 ? 'task' : 'tasks'} left before you are qualified on everything in the catalogue.
      </p>
      <ProgressMatrix progress={progress.data} mayDecide={false} />
      <RecordPracticeForm />
      <MyReviewComments />
      <section aria-label="My training entries" className="flex flex-col gap-2">
        <h2 className="text-lg font-bold">My training entries</h2>
        <EntryList entries={progress.data.entries} mayAmend />
      </section>
    </div>
  );
}

export function TrainingPage() {
  const { data: me } = useMe();
  const tabs = me ? tabsFor(me.role) : [];
  const [chosen, setChosen] = useState<Tab | null>(null);
  const zone = useTrainingZone();
  const tab = chosen && tabs.includes(chosen) ? chosen : tabs[0];
  if (!me || !tab) return null;
  const mayEdit = can(me.role, 'training.catalogue');
  return (
    <section className="flex flex-col gap-4">
      <div>
        <h1 className="text-2xl font-bold">Training</h1>
        <p className="text-muted">Qualification tasks on the cooling-water and condenser systems, practice countersigned by operators and signed off by trainers.</p>
        <ZoneNote zone={zone} basis={zone?.basis} what="Dates and times" />
      </div>
      <aside className="rounded-md border border-watch bg-panel px-4 py-2 text-sm" aria-label="Caution">
        <strong>Caution — </strong>a sign-off here records training; it does not authorise anyone to operate plant. The station’s qualification procedure and the shift lead decide who may do what.
      </aside>
      <div role="group" aria-label="Training views" className="flex flex-wrap gap-1 border-b border-line">
        {tabs.map((t) => (
          <Button key={t} tone="tab" pressed={t === tab} onClick={() => setChosen(t)}>
            {tabLabels[t]}
          </Button>
        ))}
      </div>
      <div aria-label={tabLabels[tab]} role="region">
        {tab === 'mine' ? <MyRecord /> : null}
        {tab === 'countersign' ? <CountersignQueue /> : null}
        {tab === 'queue' ? <ReviewQueue /> : null}
        {tab === 'crews' ? <CrewQualifications defaultCrewId={me.crewId} /> : null}
        {tab === 'catalogue' ? <CataloguePanel mayEdit={mayEdit} /> : null}
      </div>
    </section>
  );
}
