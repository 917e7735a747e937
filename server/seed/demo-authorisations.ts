import type { CertificateKind } from '../../shared/authorisations/kinds.js';

// The demo's scopes, certificates and paper authorisations. Invented for the demo; days count from seeding.
// The demo's first-aid certificates are of the 'first_aid' kind; tests build their own scopes on 'first_aid_cpr',
// so a demo person is never issued a test's scope when something re-decides their record.

type Requirement =
  | { kind: 'procedure_ack' | 'checklist_signoff'; procedure: string }
  | { kind: 'practicals'; procedure: string; count: number; windowMonths: number }
  | { kind: 'prerequisite'; scope: string }
  | { kind: 'certificate'; certificateKind: CertificateKind };

export const DEMO_SCOPES: {
  code: string; title: string; description: string; maxVoltageV: number; maxCurrentA: number; allowsLiveWork: boolean;
  validityMonths: number; reminderOffsetsDays: number[]; certificateGraceDays: number; requirements: Requirement[];
}[] = [
  {
    code: 'DEAD-MAINS', title: 'Dead work on mains equipment',
    description: 'Opening, repairing and reassembling mains-powered units on the bench once they are isolated, locked off and proved dead. Nothing is worked on live.',
    maxVoltageV: 250, maxCurrentA: 16, allowsLiveWork: false, validityMonths: 24, reminderOffsetsDays: [60, 30, 7], certificateGraceDays: 0,
    requirements: [{ kind: 'procedure_ack', procedure: 'BO-ISO-01' }, { kind: 'certificate', certificateKind: 'first_aid' }],
  },
  {
    code: 'LIVE-ISO-RCD', title: 'Live testing behind an isolating transformer and 30 mA RCD',
    description: 'Measurements on an energised unit under test fed from the bench isolating transformer, with the bench behind a 30 mA Type A RCD. Connections are changed only with the unit dead.',
    maxVoltageV: 250, maxCurrentA: 10, allowsLiveWork: true, validityMonths: 12, reminderOffsetsDays: [60, 30, 7], certificateGraceDays: 14,
    requirements: [
      { kind: 'prerequisite', scope: 'DEAD-MAINS' }, { kind: 'procedure_ack', procedure: 'BO-LIVE-02' },
      { kind: 'practicals', procedure: 'BO-LIVE-02', count: 2, windowMonths: 12 }, { kind: 'certificate', certificateKind: 'first_aid' },
    ],
  },
  {
    code: 'LIVE-PHASE-250', title: 'Live fault-finding on phase-control circuits up to 250 V / 10 A',
    description: 'Fault-finding with the unit energised on triac lamp dimmers, universal-motor speed controllers and heater regulators, within the limits of the bench set-up.',
    maxVoltageV: 250, maxCurrentA: 10, allowsLiveWork: true, validityMonths: 12, reminderOffsetsDays: [60, 30, 7], certificateGraceDays: 14,
    requirements: [
      { kind: 'prerequisite', scope: 'LIVE-ISO-RCD' }, { kind: 'procedure_ack', procedure: 'BO-FF-03' },
      { kind: 'practicals', procedure: 'BO-FF-03', count: 1, windowMonths: 12 }, { kind: 'certificate', certificateKind: 'release_from_live_parts' },
    ],
  },
];

export const DEMO_CERTIFICATES: {
  holder: string; kind: CertificateKind; issuer: string; reference: string; issuedDaysAgo: number; expiresInDays: number; submittedDaysAgo: number; verifiedBy: string | null;
}[] = [
  { holder: 'technician2@demo.breakover.test', kind: 'first_aid', issuer: 'Erste-Hilfe-Schule Leipzig-Süd', reference: 'EH-24-0912', issuedDaysAgo: 710, expiresInDays: 20, submittedDaysAgo: 700, verifiedBy: 'manager@demo.breakover.test' },
  { holder: 'technician2@demo.breakover.test', kind: 'release_from_live_parts', issuer: 'Werkstattverbund Sachsen', reference: 'RL-25-044', issuedDaysAgo: 300, expiresInDays: 430, submittedDaysAgo: 290, verifiedBy: 'manager@demo.breakover.test' },
  { holder: 'technician3@demo.breakover.test', kind: 'first_aid', issuer: 'Lakeshore Safety Training', reference: 'LST-55120', issuedDaysAgo: 200, expiresInDays: 530, submittedDaysAgo: 195, verifiedBy: 'manager2@demo.breakover.test' },
  { holder: 'assessor@demo.breakover.test', kind: 'first_aid', issuer: 'Erste-Hilfe-Schule Leipzig-Süd', reference: 'EH-25-1407', issuedDaysAgo: 100, expiresInDays: 630, submittedDaysAgo: 95, verifiedBy: 'manager@demo.breakover.test' },
  { holder: 'assessor@demo.breakover.test', kind: 'release_from_live_parts', issuer: 'Werkstattverbund Sachsen', reference: 'RL-25-101', issuedDaysAgo: 100, expiresInDays: 630, submittedDaysAgo: 95, verifiedBy: 'manager@demo.breakover.test' },
  // Waiting for a manager: checking it completes Tomasz's "Dead work on mains equipment".
  { holder: 'technician@demo.breakover.test', kind: 'first_aid', issuer: 'Erste-Hilfe-Schule Leipzig-Süd', reference: 'EH-26-0233', issuedDaysAgo: 10, expiresInDays: 720, submittedDaysAgo: 2, verifiedBy: null },
];

export const DEMO_PRIORS: { holder: string; scope: string; issuedDaysAgo: number; expiresInDays: number; attestedBy: string; recordedBy: string; note: string }[] = [
  { holder: 'technician2@demo.breakover.test', scope: 'DEAD-MAINS', issuedDaysAgo: 420, expiresInDays: 310, attestedBy: 'Heike Krause, workshop lead until 2025 (training register p. 14)', recordedBy: 'manager@demo.breakover.test', note: 'Scan of the signed register page in the personnel file.' },
  { holder: 'technician2@demo.breakover.test', scope: 'LIVE-ISO-RCD', issuedDaysAgo: 340, expiresInDays: 25, attestedBy: 'Heike Krause, workshop lead until 2025 (training register p. 15)', recordedBy: 'manager@demo.breakover.test', note: 'Two witnessed dimmer tests noted on the back of the card.' },
  { holder: 'technician3@demo.breakover.test', scope: 'DEAD-MAINS', issuedDaysAgo: 240, expiresInDays: 490, attestedBy: 'Dana Whitcombe (authorisation card no. 0417)', recordedBy: 'manager2@demo.breakover.test', note: '' },
  { holder: 'assessor@demo.breakover.test', scope: 'DEAD-MAINS', issuedDaysAgo: 500, expiresInDays: 230, attestedBy: 'Heike Krause, workshop lead until 2025 (training register p. 9)', recordedBy: 'manager@demo.breakover.test', note: '' },
  { holder: 'assessor@demo.breakover.test', scope: 'LIVE-ISO-RCD', issuedDaysAgo: 330, expiresInDays: 160, attestedBy: 'Heike Krause, workshop lead until 2025 (training register p. 10)', recordedBy: 'manager@demo.breakover.test', note: '' },
  { holder: 'assessor@demo.breakover.test', scope: 'LIVE-PHASE-250', issuedDaysAgo: 300, expiresInDays: 65, attestedBy: 'Heike Krause, workshop lead until 2025 (training register p. 11)', recordedBy: 'manager@demo.breakover.test', note: 'Assessed on the motor controller bench.' },
];
