/** Every migration in order. Add a new file and list it here (names sort by their number). */
import * as m0001 from './0001-foundation';
import * as m0002 from './0002-plan-units';

export const migrations = [
  { name: '0001-foundation', ...m0001 },
  { name: '0002-plan-units', ...m0002 },
];
