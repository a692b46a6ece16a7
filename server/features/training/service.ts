// Qualification tasks, training entries, countersigns and trainer decisions. Entries and decisions
// are never edited: a countersign or rejection moves an entry once out of "awaiting", and every
// later correction is an amendment with a reason and a name, written to the audit trail too.
import { Op, type Sequelize, type Transaction } from 'sequelize';
import type { NewTrainingEntry, QualificationTaskInput, TaskStatus } from '../../../shared/schemas/training';
import { countersignsAnyEntry, mayAmendTraining, mayCountersignEntry, whyNotCountersign } from '../../../shared/policies/training';
import { can } from '../../../shared/policies/permissions';
import { recordAudit } from '../../lib/audit';
import { publish } from '../../lib/live';
import { unitOfWork } from '../../lib/unit-of-work';
import { Conflict, Forbidden, NotFound, ValidationError } from '../../lib/errors';
import { findPeople, findPerson, lockPerson, namesOf } from '../users/index';
import { findCrew, findUnit } from '../plant/index';
import { findRound } from '../readings/index';
import { handoverItemExists } from '../handovers/index';
import { settingsForStation } from '../stations/index';
import { shiftStartFor } from '../../../shared/shift-time';
import { QualificationTask, TrainingAmendment, TrainingDecision, TrainingEntry } from './model';

type Actor = Express.User;
const PERFORMANCES: readonly string[] = ['supervised', 'alone'];

/** The newest version of each task key (retired ones only when asked). */
export async function currentTasks(options: { includeRetired?: boolean; transaction?: Transaction } = {}) {
  return [...latestVersions(await allTaskVersions(options.transaction)).values()].filter((t) => options.includeRetired || !t.retired);
}

/** Every version of every task, oldest version first within a key. */
const allTaskVersions = (transaction?: Transaction) => QualificationTask.findAll({ order: [['taskKey', 'ASC'], ['version', 'ASC']], transaction });

/** The newest version per task key, from versions ordered oldest first. */
function latestVersions(versions: QualificationTask[]) {
  const latest = new Map<string, QualificationTask>();
  for (const task of versions) latest.set(task.taskKey, task);
  return latest;
}

async function currentTask(taskKey: string, transaction?: Transaction) {
  const task = await QualificationTask.findOne({ where: { taskKey }, order: [['version', 'DESC']], transaction });
  if (!task) throw new NotFound('That qualification task');
  return task;
}

export function presentTask(t: QualificationTask) {
  return {
    id: t.id,
    taskKey: t.taskKey,
    version: t.version,
    position: t.position,
    system: t.system,
    title: t.title,
    standard: t.standard,
    procedureRef: t.procedureRef,
    requiredPerformances: t.requiredPerformances,
    retired: t.retired,
    changeNote: t.changeNote,
    createdAt: t.createdAt.toISOString(),
  };
}

/** Every version of one task, newest first. */
export async function taskVersions(taskKey: string) {
  const versions = await QualificationTask.findAll({ where: { taskKey }, order: [['version', 'DESC']] });
  if (versions.length === 0) throw new NotFound('That qualification task');
  return versions.map(presentTask);
}

export function makeTrainingService(sequelize: Sequelize) {
  async function createTask(actor: Actor, input: QualificationTaskInput & { taskKey: string }) {
    return unitOfWork(sequelize, async (transaction) => {
      if (await QualificationTask.findOne({ where: { taskKey: input.taskKey }, transaction })) throw new ValidationError({ taskKey: 'A task with this key exists already' });
      const task = await QualificationTask.create(
        { ...input, procedureRef: input.procedureRef ?? null, version: 1, retired: false, changeNote: 'First version', createdBy: actor.id, createdAt: new Date() },
        { transaction },
      );
      await recordAudit({ actorId: actor.id, action: 'training.task.create', entity: 'qualification_task', entityId: task.id, after: presentTask(task) }, transaction);
      publish(transaction, { entity: 'training', id: task.id });
      return presentTask(task);
    });
  }

  /** A change is the next version of the task; earlier entries and sign-offs keep theirs. */
  async function changeTask(actor: Actor, taskKey: string, change: Partial<QualificationTaskInput> & { retired?: boolean; changeNote: string }) {
    return unitOfWork(sequelize, async (transaction) => {
      const before = await currentTask(taskKey, transaction);
      if (before.retired) throw new Conflict('This task is retired');
      const { id: _id, createdAt: _at, ...fields } = before.get({ plain: true });
      const task = await QualificationTask.create(
        { ...fields, ...change, procedureRef: change.procedureRef ?? (change.procedureRef === null ? null : fields.procedureRef), version: before.version + 1, createdBy: actor.id, createdAt: new Date() },
        { transaction },
      );
      await recordAudit({ actorId: actor.id, action: change.retired ? 'training.task.retire' : 'training.task.change', entity: 'qualification_task', entityId: task.id, before: presentTask(before), after: presentTask(task) }, transaction);
      publish(transaction, { entity: 'training', id: task.id });
      return presentTask(task);
    });
  }

  async function recordEntry(actor: Actor, input: NewTrainingEntry) {
    const task = await currentTask(input.taskKey);
    if (task.retired) throw new ValidationError({ taskKey: 'This task is retired' });
    const fields: Record<string, string> = {};
    // "Today" somewhere on Earth (up to UTC+14): a trainee just past local midnight east of UTC is not refused.
    if (input.performedOn > new Date(Date.now() + 14 * 3_600_000).toISOString().slice(0, 10)) fields.performedOn = 'The date is in the future';
    const unit = input.unitId ? await findUnit(input.unitId) : null;
    if (input.unitId && !unit) fields.unitId = 'No such unit';
    if (input.shiftStart && !input.unitId) fields.unitId = 'Say which unit the shift was on';
    if (input.shiftStart && unit) {
      const settings = await settingsForStation(unit.stationId);
      const start = new Date(input.shiftStart);
      if (shiftStartFor(start, settings.timeZone, settings.shiftChangeTimes).getTime() !== start.getTime()) fields.shiftStart = 'That time is not the start of a shift';
    }
    const round = input.readingSetId ? await findRound(input.readingSetId) : null;
    if (input.readingSetId && (!round || (input.unitId && round.unitId !== input.unitId))) fields.readingSetId = 'No such round on this unit';
    if (input.handoverItemId && !(await handoverItemExists(input.handoverItemId))) fields.handoverItemId = 'No such handover item';
    if (input.supervisorId) {
      const supervisor = await findPerson(input.supervisorId);
      if (!supervisor || !supervisor.active || !can(supervisor.role, 'training.countersign')) fields.supervisorId = 'Choose an operator or shift lead';
    }
    if (Object.keys(fields).length) throw new ValidationError(fields);
    return unitOfWork(sequelize, async (transaction) => {
      const entry = await TrainingEntry.create(
        {
          traineeId: actor.id,
          taskId: task.id,
          performedOn: input.performedOn,
          level: input.level,
          unitId: input.unitId ?? null,
          shiftStart: input.shiftStart ? new Date(input.shiftStart) : null,
          readingSetId: input.readingSetId ?? null,
          handoverItemId: input.handoverItemId ?? null,
          note: input.note,
          supervisorId: input.supervisorId ?? null,
          status: 'awaiting_countersign',
          countersignedBy: null,
          countersignedAt: null,
          rejectReason: null,
          recordedAt: new Date(),
        },
        { transaction },
      );
      await recordAudit({ actorId: actor.id, action: 'training.entry.record', entity: 'training_entry', entityId: entry.id, after: { taskId: task.id, level: input.level } }, transaction);
      publish(transaction, { entity: 'training', id: entry.id });
      return entry;
    });
  }

  /** Countersign or reject, once: the update only applies to an entry still awaiting. */
  async function settleEntry(actor: Actor, entryId: number, outcome: { status: 'countersigned' } | { status: 'rejected'; reason: string }) {
    const entry = await TrainingEntry.findByPk(entryId);
    if (!entry) throw new NotFound('That training entry');
    if (!mayCountersignEntry(actor, entry)) throw new Forbidden(whyNotCountersign(actor, entry));
    await unitOfWork(sequelize, async (transaction) => {
      const [updated] = await TrainingEntry.update(
        { status: outcome.status, countersignedBy: actor.id, countersignedAt: new Date(), rejectReason: outcome.status === 'rejected' ? outcome.reason : null },
        { where: { id: entryId, status: 'awaiting_countersign' }, transaction },
      );
      if (!updated) throw new Conflict('This entry is countersigned or rejected already');
      await recordAudit({ actorId: actor.id, action: `training.entry.${outcome.status}`, entity: 'training_entry', entityId: entryId }, transaction);
      publish(transaction, { entity: 'training', id: entryId });
    });
  }

  async function decide(actor: Actor, input: { traineeId: number; taskKey: string; decision: 'signed_off' | 'returned'; comments: string }) {
    const trainee = await findPerson(input.traineeId);
    if (!trainee || trainee.role !== 'trainee') throw new ValidationError({ traineeId: 'Choose a trainee' });
    if (trainee.id === actor.id) throw new Forbidden('Nobody signs off their own training');
    return unitOfWork(sequelize, async (transaction) => {
      const task = await currentTask(input.taskKey, transaction);
      if (task.retired) throw new Conflict('This task is retired');
      // Serialise decisions for one trainee and task: the lock is the trainee's row.
      await lockPerson(trainee.id, transaction);
      const last = await TrainingDecision.findOne({ where: { traineeId: trainee.id, taskKey: task.taskKey }, order: [['id', 'DESC']], transaction });
      if (last?.decision === 'signed_off') throw new Conflict('This task is signed off already; a sign-off is never changed (add an amendment instead)');
      if (input.decision === 'signed_off') {
        const done = await performancesCounted(trainee.id, task.taskKey, transaction);
        if (done < task.requiredPerformances) {
          throw new Conflict(`Not ready: ${done} of ${task.requiredPerformances} countersigned supervised or solo performances`);
        }
      }
      const decision = await TrainingDecision.create(
        { traineeId: trainee.id, taskId: task.id, taskKey: task.taskKey, decision: input.decision, comments: input.comments, trainerId: actor.id, decidedAt: new Date() },
        { transaction },
      );
      await recordAudit({ actorId: actor.id, action: `training.${input.decision}`, entity: 'training_decision', entityId: decision.id, after: { traineeId: trainee.id, taskId: task.id } }, transaction);
      publish(transaction, { entity: 'training', id: decision.id });
      return decision;
    });
  }

  async function amend(actor: Actor, input: { target: 'entry' | 'decision'; targetId: number; reason: string; text: string }) {
    if (input.target === 'entry') {
      const entry = await TrainingEntry.findByPk(input.targetId);
      if (!entry) throw new NotFound('That training entry');
      if (!mayAmendTraining(actor, { kind: 'entry', traineeId: entry.traineeId })) throw new Forbidden('Only the trainee who wrote it or a trainer amends a training entry');
    } else {
      if (!mayAmendTraining(actor, { kind: 'decision' })) throw new Forbidden('Only a trainer amends a sign-off');
      if (!(await TrainingDecision.findByPk(input.targetId))) throw new NotFound('That decision');
    }
    return unitOfWork(sequelize, async (transaction) => {
      const amendment = await TrainingAmendment.create({ ...input, authorId: actor.id, amendedAt: new Date() }, { transaction });
      await recordAudit({ actorId: actor.id, action: `training.${input.target}.amend`, entity: `training_${input.target}`, entityId: input.targetId, after: { reason: input.reason, text: input.text } }, transaction);
      publish(transaction, { entity: 'training', id: input.targetId });
      return amendment;
    });
  }

  return { createTask, changeTask, recordEntry, settleEntry, decide, amend };
}
export type TrainingService = ReturnType<typeof makeTrainingService>;

/** Countersigned supervised or solo performances of a task (any version of it). */
async function performancesCounted(traineeId: number, taskKey: string, transaction?: Transaction) {
  const versions = (await QualificationTask.findAll({ where: { taskKey }, attributes: ['id'], transaction })).map((t) => t.id);
  return TrainingEntry.count({ where: { traineeId, taskId: versions, status: 'countersigned', level: PERFORMANCES as string[] }, transaction });
}

/** Every task of the current catalogue (plus retired ones with history) and where the trainee stands. */
// `catalogue` lets a caller working through many trainees read the task versions once.
export async function progressOf(traineeId: number, catalogue?: QualificationTask[]) {
  const trainee = await findPerson(traineeId);
  if (!trainee) throw new NotFound('That person');
  const [allVersions, entries, decisions] = await Promise.all([
    catalogue ?? allTaskVersions(),
    TrainingEntry.findAll({ where: { traineeId }, order: [['performedOn', 'ASC'], ['id', 'ASC']] }),
    TrainingDecision.findAll({ where: { traineeId }, order: [['id', 'ASC']] }),
  ]);
  const amendments = await TrainingAmendment.findAll({
    where: {
      [Op.or]: [
        { target: 'entry', targetId: entries.map((e) => e.id) },
        { target: 'decision', targetId: decisions.map((d) => d.id) },
      ],
    },
    order: [['id', 'ASC']],
  });
  const who = await namesOf([...entries.flatMap((e) => [e.countersignedBy, e.supervisorId]), ...decisions.map((d) => d.trainerId), ...amendments.map((a) => a.authorId)]);
  const versionById = new Map(allVersions.map((t) => [t.id, t]));
  const latest = latestVersions(allVersions);
  const amendmentsOf = (target: 'entry' | 'decision', id: number) =>
    amendments.filter((a) => a.target === target && a.targetId === id).map((a) => ({ id: a.id, by: who.get(a.authorId) ?? `#${a.authorId}`, at: a.amendedAt.toISOString(), reason: a.reason, text: a.text }));

  const presentEntry = (e: TrainingEntry) => {
    const task = versionById.get(e.taskId)!;
    return {
      id: e.id,
      taskKey: task.taskKey,
      taskTitle: task.title,
      taskVersion: task.version,
      performedOn: e.performedOn,
      level: e.level,
      unitId: e.unitId,
      shiftStart: e.shiftStart?.toISOString() ?? null,
      readingSetId: e.readingSetId,
      handoverItemId: e.handoverItemId,
      note: e.note,
      supervisor: e.supervisorId ? (who.get(e.supervisorId) ?? null) : null,
      status: e.status,
      countersignedBy: e.countersignedBy ? (who.get(e.countersignedBy) ?? `#${e.countersignedBy}`) : null,
      countersignedAt: e.countersignedAt?.toISOString() ?? null,
      rejectReason: e.rejectReason,
      recordedAt: e.recordedAt.toISOString(),
      amendments: amendmentsOf('entry', e.id),
    };
  };
  const presentDecision = (d: TrainingDecision) => ({
    id: d.id,
    taskKey: d.taskKey,
    taskVersion: versionById.get(d.taskId)?.version ?? null,
    decision: d.decision,
    comments: d.comments,
    trainer: who.get(d.trainerId) ?? `#${d.trainerId}`,
    decidedAt: d.decidedAt.toISOString(),
    amendments: amendmentsOf('decision', d.id),
  });

  const rows = [...latest.values()]
    .filter((t) => !t.retired || entries.some((e) => versionById.get(e.taskId)?.taskKey === t.taskKey))
    .map((task) => {
      const mine = entries.filter((e) => versionById.get(e.taskId)?.taskKey === task.taskKey);
      const counted = mine.filter((e) => e.status === 'countersigned');
      const performances = counted.filter((e) => PERFORMANCES.includes(e.level)).length;
      const taskDecisions = decisions.filter((d) => d.taskKey === task.taskKey);
      const last = taskDecisions.at(-1);
      const countedSinceReturn = last?.decision === 'returned' ? counted.filter((e) => e.countersignedAt! > last.decidedAt).length : 0;
      let status: TaskStatus = mine.length ? 'in_progress' : 'not_started';
      if (performances >= task.requiredPerformances) status = 'ready_for_sign_off';
      if (last?.decision === 'returned' && countedSinceReturn === 0) status = 'returned';
      if (last?.decision === 'signed_off') status = 'signed_off';
      const signedVersion = last?.decision === 'signed_off' ? (versionById.get(last.taskId)?.version ?? null) : null;
      return {
        task: presentTask(task),
        status,
        counts: {
          observed: counted.filter((e) => e.level === 'observed').length,
          supervised: counted.filter((e) => e.level === 'supervised').length,
          alone: counted.filter((e) => e.level === 'alone').length,
          awaitingCountersign: mine.filter((e) => e.status === 'awaiting_countersign').length,
          rejected: mine.filter((e) => e.status === 'rejected').length,
        },
        performances,
        firstPracticeOn: mine[0]?.performedOn ?? null,
        lastPracticeOn: mine.at(-1)?.performedOn ?? null,
        lastDecision: last ? presentDecision(last) : null,
        signedVersion,
        newerVersionSinceSignOff: signedVersion !== null && signedVersion < task.version,
      };
    });
  return {
    trainee: { id: trainee.id, name: trainee.name, role: trainee.role },
    rows,
    left: rows.filter((r) => r.status !== 'signed_off' && !r.task.retired).length,
    entries: [...entries].reverse().map(presentEntry),
    decisions: [...decisions].reverse().map(presentDecision),
  };
}

/** Who in a crew is signed off for which task (the newest decision per task counts). */
export async function crewQualifications(crewId: number) {
  const crew = await findCrew(crewId);
  if (!crew) throw new NotFound('That crew');
  const members = await findPeople({ crewIds: [crewId], activeOnly: true });
  const tasks = await currentTasks();
  const decisions = members.length ? await TrainingDecision.findAll({ where: { traineeId: members.map((m) => m.id) }, order: [['id', 'ASC']] }) : [];
  const last = new Map<string, TrainingDecision>();
  for (const d of decisions) last.set(`${d.traineeId}|${d.taskKey}`, d);
  return {
    crew: { id: crew.id, name: crew.name },
    tasks: tasks.map(presentTask),
    people: members.map((m) => ({
      id: m.id,
      name: m.name,
      role: m.role,
      signedOff: tasks.filter((t) => last.get(`${m.id}|${t.taskKey}`)?.decision === 'signed_off').map((t) => ({ taskKey: t.taskKey, at: last.get(`${m.id}|${t.taskKey}`)!.decidedAt.toISOString() })),
    })),
  };
}

/** Entries waiting for this person's countersign: named on them, or open to any operator; all for a shift lead. */
export async function countersignQueue(actor: Actor) {
  const where: Record<string | symbol, unknown> = { status: 'awaiting_countersign', traineeId: { [Op.ne]: actor.id } };
  if (!countersignsAnyEntry(actor)) where[Op.or] = [{ supervisorId: null }, { supervisorId: actor.id }];
  return presentQueueEntries(await TrainingEntry.findAll({ where, order: [['recordedAt', 'ASC']], limit: 200 }));
}

async function presentQueueEntries(entries: TrainingEntry[]) {
  if (entries.length === 0) return [];
  const tasks = new Map((await QualificationTask.findAll({ where: { id: [...new Set(entries.map((e) => e.taskId))] } })).map((t) => [t.id, t]));
  const who = await namesOf(entries.flatMap((e) => [e.traineeId, e.supervisorId, e.countersignedBy]));
  return entries.map((e) => ({
    id: e.id,
    trainee: who.get(e.traineeId) ?? `#${e.traineeId}`,
    traineeId: e.traineeId,
    taskKey: tasks.get(e.taskId)?.taskKey ?? '',
    taskTitle: tasks.get(e.taskId)?.title ?? '',
    taskVersion: tasks.get(e.taskId)?.version ?? null,
    performedOn: e.performedOn,
    level: e.level,
    note: e.note,
    supervisor: e.supervisorId ? (who.get(e.supervisorId) ?? null) : null,
    countersignedBy: e.countersignedBy ? (who.get(e.countersignedBy) ?? null) : null,
    countersignedAt: e.countersignedAt?.toISOString() ?? null,
    recordedAt: e.recordedAt.toISOString(),
  }));
}

/** The trainer's queue: tasks ready for sign-off, entries countersigned since the last decision, entries still awaiting a countersign. */
export async function trainerQueue() {
  const trainees = await findPeople({ roles: ['trainee'], activeOnly: true });
  const catalogue = await allTaskVersions();
  const progress = await Promise.all(trainees.map((t) => progressOf(t.id, catalogue)));
  const ready = progress.flatMap((p) =>
    p.rows.filter((r) => r.status === 'ready_for_sign_off').map((r) => ({ traineeId: p.trainee.id, trainee: p.trainee.name, taskKey: r.task.taskKey, taskTitle: r.task.title, performances: r.performances, required: r.task.requiredPerformances })),
  );
  const awaiting = await presentQueueEntries(await TrainingEntry.findAll({ where: { status: 'awaiting_countersign' }, order: [['recordedAt', 'ASC']], limit: 200 }));
  const recentlyCountersigned = progress.flatMap((p) =>
    p.entries
      .filter((e) => e.status === 'countersigned')
      .filter((e) => {
        const last = p.decisions.find((d) => d.taskKey === e.taskKey); // decisions are newest first
        return !last || (e.countersignedAt ?? '') > last.decidedAt;
      })
      .map((e) => ({ ...e, trainee: p.trainee.name, traineeId: p.trainee.id })),
  );
  return {
    trainees: progress.map((p) => ({ id: p.trainee.id, name: p.trainee.name, left: p.left, signedOff: p.rows.filter((r) => r.status === 'signed_off').length })),
    ready,
    recentlyCountersigned,
    awaiting,
  };
}
