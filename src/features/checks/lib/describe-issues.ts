/** A sentence from zod issues for a form: "pairs.0.open: open (6) is larger than …". */
export function describeIssues(issues: readonly { path: PropertyKey[]; message: string }[]): string {
  return issues
    .slice(0, 3)
    .map((issue) => (issue.path.length > 0 && !issue.message.startsWith(String(issue.path[issue.path.length - 1])) ? `${issue.path.map(String).join('.')}: ${issue.message}` : issue.message))
    .join('; ');
}
