/** Every migration in order. Add a new file and list it here (names sort by their number). */
import * as m0001 from './0001-foundation';

export const migrations = [{ name: '0001-foundation', ...m0001 }];
