import type { LabRole } from '@provenote/shared';

/**
 * The demo lab's sign-ins. They exist only in a local installation seeded with demo data, and are shown on
 * the sign-in page only in the embedded (local) mode.
 */
export const DEMO_PASSWORD = 'provenote-demo';
export const DEMO_LAB_NAME = 'Lake Tarn provenance group (synthetic demo)';
export const DEMO_ACCOUNTS: { email: string; displayName: string; role: LabRole }[] = [
  { email: 'pi@demo.provenote.test', displayName: 'Dr. Ines Varga (demo PI)', role: 'pi' },
  { email: 'analyst@demo.provenote.test', displayName: 'Tomas Lind (demo analyst)', role: 'analyst' },
  { email: 'student@demo.provenote.test', displayName: 'Aiko Sato (demo student)', role: 'student' },
  { email: 'guest@demo.provenote.test', displayName: 'Lena Brandt (demo guest)', role: 'guest' },
];
