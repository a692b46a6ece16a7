// The five roles. Order matters only for display.
export const roles = ['trainee', 'operator', 'shift_lead', 'trainer', 'admin'] as const;
export type Role = (typeof roles)[number];

export const roleLabels: Record<Role, string> = {
  trainee: 'Trainee',
  operator: 'Operator',
  shift_lead: 'Shift lead',
  trainer: 'Trainer',
  admin: 'Administrator',
};
