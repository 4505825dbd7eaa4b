import type { Role } from '../../shared/schemas/common';

export interface RoleGuide {
  /** One sentence: what this role is for. */
  summary: string;
  /** What people in the role do in Benchwire, as the product grows. */
  tasks: readonly string[];
}

/** What each staff role does at an outlet, in Benchwire's words; shown on the dashboard and when choosing a role. */
export const roleGuides: Record<Role, RoleGuide> = {
  admin: {
    summary: 'Admins look after the outlet’s staff accounts: who can sign in to Benchwire, and with which role.',
    tasks: [
      'Invite colleagues by mail and give each one a role; they choose their own password from the link.',
      'Change a role, reset a forgotten password, deactivate an account when someone leaves.',
      'Role changes, password resets and deactivations sign the person out everywhere at once.',
    ],
  },
  editor: {
    summary: 'Editors run the roundups: what gets tested, who tests and writes it, and when it goes live.',
    tasks: [
      'Plan roundups and move them from Planning through On the bench, Writing and In review.',
      'Accept or question bench results and approve the charts.',
      'Schedule the embargo and publish.',
    ],
  },
  writer: {
    summary: 'Writers turn bench results into the write-up readers see.',
    tasks: [
      'Draft the sections of a roundup and the notes per product.',
      'Propose editorial labels backed by the measurements.',
      'Hand the write-up to an editor for review.',
    ],
  },
  tester: {
    summary:
      'Bench testers run the measurements: soak each board, log VRM temperatures and power, and report what the bench saw.',
    tasks: [
      'Work through the samples assigned to your bench.',
      'Upload logger files and note anything unusual about a run.',
      'Keep the bench profile, room temperature and soak times honest.',
    ],
  },
};

/** The bench safety caution, shown wherever testers work. */
export const benchSafetyCaution = [
  'Power-delivery heatsinks and board rears get hot enough to burn: let them cool before you touch them.',
  'Work on mains-powered gear only when it is switched off and unplugged.',
  'Overclocking and raised voltages can shorten component life and void warranties; follow the maker’s limits and local electrical rules.',
  'Results come from one open test system in a controlled room and may not match a closed case in a warm room.',
] as const;
