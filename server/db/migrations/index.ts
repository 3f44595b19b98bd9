/** Every migration in order. Add a new file and list it here (names sort by their number). */
import * as m0001 from './0001-foundation';
import * as m0002 from './0002-plan-units';
import * as m0003 from './0003-practice-library';
import * as m0004 from './0004-proposals';
import * as m0005 from './0005-tasks';
import * as m0006 from './0006-invoices';
import * as m0008 from './0008-results';
import * as m0010 from './0010-ellipsoid-measures';
import * as m0012 from './0012-frozen-documents';
import * as m0014 from './0014-season-report-withdrawal';
import * as m0016 from './0016-background-jobs';
import * as m0018 from './0018-refund-request-keys';
import * as m0019 from './0019-outbox-retry-window';
import * as m0024 from './0024-geo-imports';
import * as m0026 from './0026-firm-profile';
import * as m0027 from './0027-signup';
import * as m0035 from './0035-overlay-visibility';
import * as m0040 from './0040-observations';
import * as m0050 from './0050-camera-fleet';
import * as m0060 from './0060-unit-checks';
import * as m0061 from './0061-soil-tests';
import * as m0097 from './0097-soil-test-lab-method';
import * as m0062 from './0062-season-drafts';
import * as m0063 from './0063-spray-records';
import * as m0070 from './0070-hunting-pressure';
import * as m0071 from './0071-sit-bucks';
import * as m0080 from './0080-list-read-indexes';
import * as m0085 from './0085-search-trigram';
import * as m0086 from './0086-firm-exports';
import * as m0090 from './0090-plant-back-days';
import * as m0091 from './0091-task-week-window';
import * as m0092 from './0092-plan-inputs-revision';

export const migrations = [
  { name: '0001-foundation', ...m0001 },
  { name: '0002-plan-units', ...m0002 },
  { name: '0003-practice-library', ...m0003 },
  { name: '0004-proposals', ...m0004 },
  { name: '0005-tasks', ...m0005 },
  { name: '0006-invoices', ...m0006 },
  { name: '0008-results', ...m0008 },
  { name: '0010-ellipsoid-measures', ...m0010 },
  { name: '0012-frozen-documents', ...m0012 },
  { name: '0014-season-report-withdrawal', ...m0014 },
  { name: '0016-background-jobs', ...m0016 },
  { name: '0018-refund-request-keys', ...m0018 },
  { name: '0019-outbox-retry-window', ...m0019 },
  { name: '0024-geo-imports', ...m0024 },
  { name: '0026-firm-profile', ...m0026 },
  { name: '0027-signup', ...m0027 },
  { name: '0035-overlay-visibility', ...m0035 },
  { name: '0040-observations', ...m0040 },
  { name: '0050-camera-fleet', ...m0050 },
  { name: '0060-unit-checks', ...m0060 },
  { name: '0061-soil-tests', ...m0061 },
  { name: '0062-season-drafts', ...m0062 },
  { name: '0063-spray-records', ...m0063 },
  { name: '0070-hunting-pressure', ...m0070 },
  { name: '0071-sit-bucks', ...m0071 },
  { name: '0080-list-read-indexes', ...m0080 },
  { name: '0085-search-trigram', ...m0085 },
  { name: '0086-firm-exports', ...m0086 },
  { name: '0090-plant-back-days', ...m0090 },
  { name: '0091-task-week-window', ...m0091 },
  { name: '0092-plan-inputs-revision', ...m0092 },
  { name: '0097-soil-test-lab-method', ...m0097 },
];
