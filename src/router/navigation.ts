import { mdiAccountCircleOutline, mdiAccountGroupOutline, mdiEmailFastOutline, mdiHomeOutline } from '@mdi/js';
import { mdiSineWave } from '@mdi/js';
import { mdiSolderingIron, mdiMeterElectricOutline } from '@mdi/js';
import { mdiClipboardTextOutline } from '@mdi/js';
import { mdiBookAccountOutline, mdiChartBar, mdiClipboardListOutline, mdiFlagOutline, mdiLinkVariant, mdiPackageDown } from '@mdi/js';
import { mdiAccountHardHatOutline, mdiClipboardCheckMultipleOutline } from '@mdi/js';
import { mdiAccountCheckOutline, mdiCalendarClockOutline, mdiCardAccountDetailsOutline, mdiFileCertificateOutline, mdiFileImportOutline, mdiShieldKeyOutline } from '@mdi/js';
import type { Action, SubjectName } from '@shared/abilities';

export interface NavItem {
  title: string;
  /** One line for the home page cards. */
  description: string;
  icon: string;
  /** A route name from routes.ts. */
  to: string;
  /** Who sees the entry; keep it the same as the route's `meta.can`. */
  can?: readonly [Action, SubjectName];
  /** Left off the home page cards (the home page itself). */
  hideOnHome?: boolean;
}

/** The navigation, in order. A later feature adds its entry with one line. */
export const navItems: NavItem[] = [
  { title: 'Home', description: 'Your starting page.', icon: mdiHomeOutline, to: 'home', hideOnHome: true },
  { title: 'People', description: 'Invite people, give them roles and sites, and switch accounts off with a reason.', icon: mdiAccountGroupOutline, to: 'people', can: ['invite', 'User'] },
  { title: 'Outgoing mail', description: 'Every message the portal sends: what waits, what went out and what failed, with its full text.', icon: mdiEmailFastOutline, to: 'outbox', can: ['read', 'MailLog'] },
  { title: 'Benches', description: 'Bench set-up, inspection dates and signed pre-use checks.', icon: mdiSolderingIron, to: 'benches', can: ['read', 'Bench'] },
  { title: 'Test instruments', description: 'Measurement category, voltage rating and calibration of the instruments in use.', icon: mdiMeterElectricOutline, to: 'instruments', can: ['read', 'Instrument'] },
  { title: 'My sign-offs and practicals', description: 'Fill in and sign your checklists and bench pre-use checks; see your practicals and their outcomes.', icon: mdiClipboardCheckMultipleOutline, to: 'my-records', can: ['create', 'Signoff'] },
  { title: 'At your sites', description: 'Sign-offs waiting for a countersignature, and the practicals run at the sites you cover.', icon: mdiAccountHardHatOutline, to: 'site-records', can: ['review', 'Signoff'] },
  { title: 'Bench calculator', description: 'Firing angle, power, waveforms and device temperature for a phase-control circuit; published test limits.', icon: mdiSineWave, to: 'calculator' },
  { title: 'Procedures', description: 'Bench-safety procedures under document control: versions, hold points, checklists and who has acknowledged them.', icon: mdiClipboardTextOutline, to: 'procedures', can: ['read', 'Procedure'] },
  { title: 'Register', description: 'Who holds which scope now, or at any past moment; the evidence behind each row; CSV and PDF.', icon: mdiClipboardListOutline, to: 'register', can: ['read', 'Register'] },
  { title: 'Overview', description: 'Counts by state per site and scope, what ends in the next 30, 60 and 90 days, overdue re-reads.', icon: mdiChartBar, to: 'overview', can: ['read', 'Overview'] },
  { title: 'Incident pack', description: 'Freeze what stood at one moment for one person and bench, as a PDF with its evidence files.', icon: mdiPackageDown, to: 'incident-pack', can: ['read', 'Register'] },
  { title: 'Findings', description: 'What auditors found, and the answers and closures from the sites.', icon: mdiFlagOutline, to: 'findings', can: ['read', 'Finding'] },
  { title: 'Audit trail', description: 'Every change with who, when and the values before and after; verify the chain.', icon: mdiLinkVariant, to: 'audit-trail', can: ['read', 'AuditLog'] },
  { title: 'Your record', description: 'Everything on record about you: roles, acknowledgements, sign-offs, practicals, certificates and authorisations.', icon: mdiBookAccountOutline, to: 'my-record', can: ['read', 'PersonRecord'] },
  { title: 'What I may do', description: 'Your authorisations, their limits, the days left and what to renew.', icon: mdiAccountCheckOutline, to: 'my-authorisations', can: ['read', 'Authorisation'] },
  { title: 'Certificates', description: 'First aid, CPR and similar certificates: upload them, and check them against the original.', icon: mdiFileCertificateOutline, to: 'certificates', can: ['read', 'Certificate'] },
  { title: 'Due for renewal', description: 'Per site, the authorisations and certificates that run out soon.', icon: mdiCalendarClockOutline, to: 'authorisations-due', can: ['update', 'Authorisation'] },
  { title: 'Scopes', description: 'What each authorisation allows, within which limits, and what it requires.', icon: mdiShieldKeyOutline, to: 'scopes', can: ['update', 'Scope'] },
  { title: 'What each scope needs', description: 'For any person: each requirement met with its evidence, or what is missing.', icon: mdiCardAccountDetailsOutline, to: 'eligibility', can: ['update', 'Authorisation'] },
  { title: 'Paper authorisations', description: 'Record authorisations held before the portal, one by one or from a CSV file.', icon: mdiFileImportOutline, to: 'authorisations-prior', can: ['create', 'Authorisation'] },
  { title: 'Your account', description: 'Your details, roles and sites, and your password.', icon: mdiAccountCircleOutline, to: 'profile' },
];
