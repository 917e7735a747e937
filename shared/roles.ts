export const ROLES = ['technician', 'assessor', 'manager', 'auditor', 'admin'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  technician: 'Technician',
  assessor: 'Assessor',
  manager: 'Workshop manager',
  auditor: 'Auditor',
  admin: 'Administrator',
};

export const PERSON_TERMS = ['skilled person', 'qualified person'] as const;
export type PersonTerm = (typeof PERSON_TERMS)[number];
