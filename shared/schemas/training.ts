import { z } from 'zod';
import './messages';

export const trainingLevels = ['observed', 'supervised', 'alone'] as const;
export type TrainingLevel = (typeof trainingLevels)[number];
export const trainingLevelLabels: Record<TrainingLevel, string> = {
  observed: 'Observed',
  supervised: 'Performed under supervision',
  alone: 'Performed alone',
};

export const qualificationSystems = ['circulating_water', 'condenser_vacuum', 'cooling_tower', 'water_chemistry'] as const;
export const qualificationSystemLabels: Record<(typeof qualificationSystems)[number], string> = {
  circulating_water: 'Circulating water',
  condenser_vacuum: 'Condenser vacuum and air removal',
  cooling_tower: 'Cooling tower',
  water_chemistry: 'Water chemistry',
};

const positionKey = z.string().regex(/^[a-z][a-z0-9_]{1,39}$/, 'Lower-case letters, digits and _');

export const qualificationTaskSchema = z.object({
  position: positionKey,
  system: z.enum(qualificationSystems, { message: 'Choose one of the systems' }),
  title: z.string().trim().min(3, 'Name the task (at least 3 characters)').max(200),
  standard: z.string().trim().min(5, 'Describe the standard to meet').max(2000),
  procedureRef: z.string().trim().max(80).nullable().optional(),
  requiredPerformances: z.number({ message: 'Give a whole number' }).int('Give a whole number').min(1, 'At least 1').max(50, 'At most 50'),
});
export type QualificationTaskInput = z.infer<typeof qualificationTaskSchema>;

export const newTaskSchema = qualificationTaskSchema.extend({
  taskKey: z.string().trim().regex(/^[A-Z]{2,6}-\d{2,4}$/, 'A key like CW-01 (capitals, a dash, digits)'),
});
export const taskChangeSchema = qualificationTaskSchema.extend({
  changeNote: z.string().trim().min(3, 'Say what changed').max(500),
});
export const retireTaskSchema = z.object({ changeNote: z.string().trim().min(3, 'Say why the task is retired').max(500) });

const isoDate = z.iso.date({ message: 'Give the date as YYYY-MM-DD' });
const isoTime = z.iso.datetime({ offset: true });

export const newTrainingEntrySchema = z.object({
  taskKey: z.string().trim().min(1, 'Choose a task'),
  performedOn: isoDate,
  level: z.enum(trainingLevels, { message: 'Choose observed, supervised or alone' }),
  unitId: z.number().int().positive().nullable().optional(),
  shiftStart: isoTime.nullable().optional(),
  readingSetId: z.number().int().positive().nullable().optional(),
  handoverItemId: z.number().int().positive().nullable().optional(),
  supervisorId: z.number().int().positive().nullable().optional(),
  note: z.string().trim().min(3, 'Write a short note (at least 3 characters)').max(2000),
});
export type NewTrainingEntry = z.infer<typeof newTrainingEntrySchema>;

export const rejectEntrySchema = z.object({ reason: z.string().trim().min(5, 'Say why (at least 5 characters)').max(1000) });

export const decisionSchema = z.object({
  traineeId: z.number().int().positive(),
  taskKey: z.string().trim().min(1),
  decision: z.enum(['signed_off', 'returned'], { message: 'Sign off or return' }),
  comments: z.string().trim().min(3, 'Add comments (at least 3 characters)').max(2000),
});

export const trainingAmendmentSchema = z.object({
  target: z.enum(['entry', 'decision']),
  targetId: z.number().int().positive(),
  reason: z.string().trim().min(5, 'Say why (at least 5 characters)').max(1000),
  text: z.string().trim().min(1, 'Write the correction').max(2000).meta({ title: 'Correction' }),
});

/** Where a task stands for one trainee. */
export type TaskStatus = 'not_started' | 'in_progress' | 'ready_for_sign_off' | 'returned' | 'signed_off';
export const taskStatusLabels: Record<TaskStatus, string> = {
  not_started: 'Not started',
  in_progress: 'In progress',
  ready_for_sign_off: 'Ready for sign-off',
  returned: 'Returned with comments',
  signed_off: 'Signed off',
};
