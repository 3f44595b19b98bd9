import { describe, expect, it } from 'vitest';
import { propertyKeys, getPropertyQueryOptions } from '../../../../src/lib/resources/property';
import { taskKeys, getTaskQueryOptions } from '../../../../src/lib/resources/task';
import { fieldKeys } from '../../../../src/features/field/api/keys';
import { scheduleKeys } from '../../../../src/features/schedule/api/keys';
import { planMapKeys } from '../../../../src/features/plan-map/api/keys';
import { prescriptionKeys } from '../../../../src/features/prescriptions/api/keys';
import * as fieldTask from '../../../../src/features/field/api/get-task';
import * as scheduleTask from '../../../../src/features/schedule/api/get-task';
import * as propertiesProperty from '../../../../src/features/properties/api/get-property';
import * as planMapProperty from '../../../../src/features/plan-map/api/get-property';
import * as prescriptionsProperty from '../../../../src/features/prescriptions/api/get-property-plan';

describe('one query-options module per resource', () => {
  it('every reader of GET /api/properties/:id uses the same options and key', () => {
    for (const m of [propertiesProperty, planMapProperty, prescriptionsProperty]) expect(m.getPropertyQueryOptions).toBe(getPropertyQueryOptions);
    for (const key of [planMapKeys.property, prescriptionKeys.property]) expect(key).toBe(propertyKeys.detail);
    expect(getPropertyQueryOptions(7).queryKey).toEqual(['properties', 'detail', 7]);
  });

  it('the schedule and the field sheet read GET /api/tasks/:id through the same options and key', () => {
    for (const m of [fieldTask, scheduleTask]) expect(m.getTaskQueryOptions).toBe(getTaskQueryOptions);
    expect(fieldKeys.task).toBe(taskKeys.detail);
    expect(scheduleKeys.detail).toBe(taskKeys.detail);
    expect(getTaskQueryOptions(3).queryKey).toEqual(['tasks', 'detail', 3]);
  });
});
