import { describe, expect, it } from 'vitest';
import { SurveyFromPhotosSchema, SurveyPostSchema } from '../../../shared/schemas/cameras';
import { SurveyCreateSchema } from '../../../shared/schemas/results';

/** The first issue's path and message, as the API's 422 names them. */
const firstIssue = (result: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) => {
  const issue = result.error?.issues[0];
  return issue ? { path: issue.path, message: issue.message } : null;
};

describe('SurveyPostSchema (typed tallies or tallies from photos)', () => {
  it('checks a body with fromPhotos by the photo schema, with its messages and paths', () => {
    const body = { name: 'Late-summer survey', fromPhotos: { deploymentIds: [3, 3], from: '2026-08-01', to: '2026-08-20' } };
    const ours = SurveyPostSchema.safeParse(body);
    expect(ours.success).toBe(false);
    expect(firstIssue(ours)).toEqual(firstIssue(SurveyFromPhotosSchema.safeParse(body)));
    expect(firstIssue(ours)?.message).toBe('a deployment is picked twice');
  });

  it('checks any other body by the typed-tally schema, with its messages and paths', () => {
    const body = { name: '', startDate: '2026-08-01', endDate: '2026-08-20' };
    const ours = SurveyPostSchema.safeParse(body);
    expect(ours.success).toBe(false);
    expect(firstIssue(ours)).toEqual(firstIssue(SurveyCreateSchema.safeParse(body)));
  });

  it('answers the photo schema’s parsed value for a good photo body', () => {
    const body = { name: 'Late-summer survey', fromPhotos: { deploymentIds: [3, 4], from: '2026-08-01', to: '2026-08-20' } };
    const ours = SurveyPostSchema.safeParse(body);
    const theirs = SurveyFromPhotosSchema.safeParse(body);
    expect(theirs.success).toBe(true);
    expect(ours).toEqual(theirs);
  });
});
